import { LEADLINE_VERSION } from '@leadline/core';
import type { HealthStore } from '../stores/health-store.js';

/** The health report the API returns. */
export interface HealthReport {
  name: 'leadline';
  version: string;
  status: 'ok' | 'degraded';
  database: {
    state: 'up' | 'down';
    latencyMs: number | null;
    migrationsApplied: number;
    latestMigration: string | null;
    error?: string;
  };
}

/** Checks the database and reports the server's version and state; never throws. */
export async function checkHealth(
  store: HealthStore,
  now: () => number = performance.now.bind(performance),
): Promise<HealthReport> {
  const started = now();
  try {
    await store.ping();
    const latencyMs = Math.round((now() - started) * 10) / 10;
    const migrations = await store.appliedMigrations();
    return {
      name: 'leadline',
      version: LEADLINE_VERSION,
      status: 'ok',
      database: {
        state: 'up',
        latencyMs,
        migrationsApplied: migrations.length,
        latestMigration: migrations.at(-1) ?? null,
      },
    };
  } catch (error) {
    return {
      name: 'leadline',
      version: LEADLINE_VERSION,
      status: 'degraded',
      database: {
        state: 'down',
        latencyMs: null,
        migrationsApplied: 0,
        latestMigration: null,
        error: error instanceof Error ? error.message : String(error),
      },
    };
  }
}
