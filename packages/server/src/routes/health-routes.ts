import { z } from 'zod';
import { defineRoute, type RouteSpec } from '../http/route-table.js';
import { checkHealth } from '../services/health-service.js';
import type { HealthStore } from '../stores/health-store.js';

const HealthSchema = z.object({
  name: z.literal('leadline'),
  version: z.string(),
  status: z.enum(['ok', 'degraded']),
  database: z.object({
    state: z.enum(['up', 'down']),
    latencyMs: z.number().nullable(),
    migrationsApplied: z.number().int(),
    latestMigration: z.string().nullable(),
    error: z.string().optional(),
  }),
});

/** `GET /health` (version and database state; 503 while the database is down) and `GET /ready`. */
export function createHealthRoutes(deps: { healthStore: HealthStore }): RouteSpec[] {
  return [
    defineRoute({
      method: 'get',
      path: '/health',
      summary: 'Version and database state',
      tag: 'Health',
      access: 'public',
      responses: {
        200: { description: 'Up', schema: HealthSchema },
        503: { description: 'The database cannot be reached', schema: HealthSchema },
      },
      async handler(_input, _req, res) {
        const report = await checkHealth(deps.healthStore);
        res.status(report.database.state === 'up' ? 200 : 503).json(report);
      },
    }),
    defineRoute({
      method: 'get',
      path: '/ready',
      summary: 'Readiness: 200 when the server can take requests (database reachable and migrated)',
      tag: 'Health',
      access: 'public',
      responses: {
        200: { description: 'Ready', schema: z.object({ ready: z.literal(true) }) },
        503: { description: 'Not ready', schema: z.object({ ready: z.literal(false), reason: z.string() }) },
      },
      async handler(_input, _req, res) {
        const report = await checkHealth(deps.healthStore);
        if (report.database.state !== 'up')
          res.status(503).json({ ready: false, reason: `database down: ${report.database.error ?? 'unknown'}` });
        else if (report.database.migrationsApplied === 0)
          res.status(503).json({ ready: false, reason: 'no migrations applied; run npm run migrate' });
        else res.json({ ready: true });
      },
    }),
  ];
}
