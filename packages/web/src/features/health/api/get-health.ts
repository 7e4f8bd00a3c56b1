import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api-client';
import { healthKeys } from './keys';

/** The server's health report (mirrors the server's `HealthReport`). */
export interface Health {
  name: 'leadline';
  version: string;
  status: 'ok' | 'degraded';
  database: {
    state: 'up' | 'down';
    latencyMs: number | null;
    migrationsApplied: number;
    latestMigration: string | null;
  };
}

export function getHealth(): Promise<Health> {
  return apiFetch<Health>('/health');
}

export function healthQueryOptions() {
  return queryOptions({ queryKey: healthKeys.status(), queryFn: getHealth, refetchInterval: 60_000 });
}

export function useHealth() {
  return useQuery(healthQueryOptions());
}
