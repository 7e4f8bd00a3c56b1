import { Router } from 'express';
import { checkHealth } from '../services/health-service.js';
import type { HealthStore } from '../stores/health-store.js';

/** `GET /health`: version and database state; 503 while the database is down. */
export function createHealthRouter(deps: { healthStore: HealthStore }): Router {
  const router = Router();
  router.get('/health', async (_req, res) => {
    const report = await checkHealth(deps.healthStore);
    res.status(report.database.state === 'up' ? 200 : 503).json(report);
  });
  return router;
}
