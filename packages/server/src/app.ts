import { existsSync } from 'node:fs';
import { join } from 'node:path';
import express, { type Express } from 'express';
import helmet from 'helmet';
import { createErrorHandler, notFoundHandler } from './http/errors.js';
import { createHealthRouter } from './routes/health-routes.js';
import type { HealthStore } from './stores/health-store.js';

/** What the app is built from: its stores and settings. No listening, no environment. */
export interface AppDependencies {
  healthStore: HealthStore;
  /** Folder of the built web site; when set, it is served with a fallback to `index.html`. */
  webDist?: string | undefined;
  log?: (message: string) => void;
}

/** Builds the Express app: the versioned API under `/api/v1`, the web site beside it. */
export function createApp(deps: AppDependencies): Express {
  const log = deps.log ?? ((message: string) => console.error(message));
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');
  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: true,
        directives: {
          // Everything the site needs ships with it: no outside host, not even for fonts.
          'default-src': ["'self'"],
          'img-src': ["'self'", 'data:', 'blob:'],
          'font-src': ["'self'", 'data:'],
          'upgrade-insecure-requests': null,
        },
      },
    }),
  );

  const api = express.Router();
  api.use(express.json({ limit: '1mb' }));
  api.use(createHealthRouter(deps));
  api.use(notFoundHandler);
  app.use('/api/v1', api);
  app.use('/api', notFoundHandler);

  if (deps.webDist !== undefined && existsSync(join(deps.webDist, 'index.html'))) {
    const webDist = deps.webDist;
    app.use(express.static(webDist, { index: false, maxAge: '1h' }));
    app.get('/{*splat}', (_req, res) => {
      res.sendFile(join(webDist, 'index.html'));
    });
  }

  app.use(createErrorHandler(log));
  return app;
}
