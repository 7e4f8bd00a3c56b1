import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { LEADLINE_VERSION } from '@leadline/core';
import express, { type Express, type RequestHandler } from 'express';
import { rateLimit } from 'express-rate-limit';
import session, { type Store as SessionStore } from 'express-session';
import helmet from 'helmet';
import type { Knex } from 'knex';
import type { Logger } from 'pino';
import { createDocsRouter } from './http/docs-page.js';
import { AppError, createErrorHandler, notFoundHandler } from './http/errors.js';
import { mountRoutes } from './http/mount-routes.js';
import { buildOpenApiDocument } from './http/openapi.js';
import { createLogger, createRequestLogger } from './http/request-logger.js';
import { defineRoute, type RouteSpec } from './http/route-table.js';
import type { ProcessingQueue } from './jobs/processing-queue.js';
import type { FakeSmtpServer } from './mail/fake-smtp-server.js';
import type { Mailer } from './mail/mailer.js';
import { createApiTokenRoutes } from './routes/api-token-routes.js';
import { createAuthRoutes } from './routes/auth-routes.js';
import { createConvertRoutes } from './routes/convert-routes.js';
import { createCrsRoutes } from './routes/crs-routes.js';
import { createDiveRoutes } from './routes/dive-routes.js';
import { createHealthRoutes } from './routes/health-routes.js';
import { createInvitationRoutes } from './routes/invitation-routes.js';
import { createMailboxRoutes } from './routes/mailbox-routes.js';
import { createMemberRoutes } from './routes/member-routes.js';
import { createOrganisationRoutes } from './routes/organisation-routes.js';
import { createProjectRoutes } from './routes/project-routes.js';
import { createSiteSettingsRoutes } from './routes/site-settings-routes.js';
import { authenticateApiToken } from './services/api-token-service.js';
import { type DiveDeps, queueLogProcessing } from './services/dive-service.js';
import { RenderCache } from './services/render-cache.js';
import type { ServiceContext } from './services/service-context.js';
import { createKnexActivityStore } from './stores/activity-store.js';
import { createKnexApiTokenStore } from './stores/api-token-store.js';
import { createKnexDiveStore } from './stores/dive-store.js';
import { createKnexEmailLinkStore } from './stores/email-link-store.js';
import { createKnexHealthStore, type HealthStore } from './stores/health-store.js';
import { createKnexLogStore } from './stores/log-store.js';
import { createKnexProcessingRunStore } from './stores/processing-run-store.js';
import { createKnexProjectStore } from './stores/project-store.js';
import { createKnexUserStore } from './stores/user-store.js';

/** The name of the session cookie. */
export const SESSION_COOKIE = 'leadline.sid';

/** A fixed-window limit: at most `limit` requests per client address per `windowMs`. */
export interface RateLimitSetting {
  windowMs: number;
  limit: number;
}

/** What the app is built from: its database, session store, mailer and settings. No listening, no environment. */
export interface AppDependencies {
  db: Knex;
  /** Where sessions live (connect-pg-simple in production and tests). */
  sessionStore: SessionStore;
  sessionSecret: string;
  /** Send the session cookie over HTTPS only; on behind a TLS proxy. */
  cookieSecure?: boolean;
  mailer: Mailer;
  /** The local fake SMTP server; when set, its mailbox is served to admins. */
  fakeMailbox?: FakeSmtpServer | undefined;
  /** Base of links sent by e-mail. */
  publicUrl: string;
  uploadLimitBytes?: number;
  rateLimits?: { signIn?: RateLimitSetting; reset?: RateLimitSetting };
  logger?: Logger;
  now?: () => Date;
  /** Replaces the database health check (tests of an unreachable database). */
  healthStore?: HealthStore;
  /** Folder of the built web site; when set, it is served with a fallback to `index.html`. */
  webDist?: string | undefined;
  /** Where processing runs are sent (pg-boss); without it runs wait as `queued` for a worker. */
  processingQueue?: ProcessingQueue | undefined;
  /** XYZ template ({z}/{x}/{y}) of background map tiles; the browser may load images from its host. */
  tileUrl?: string | undefined;
  /** Credit shown over the tiles. */
  tileAttribution?: string | undefined;
}

/** The app and the route table it serves (the authorisation matrix test walks the table). */
export interface BuiltApp {
  app: Express;
  routes: readonly RouteSpec[];
}

function limiter(setting: RateLimitSetting, what: string, per: 'address' | 'account' = 'address'): RequestHandler {
  return rateLimit({
    windowMs: setting.windowMs,
    limit: setting.limit,
    // Per account: the e-mail address in the body, so many addresses cannot share out guesses at one account.
    ...(per === 'account'
      ? {
          keyGenerator: (req) => `account:${accountOf(req.body)}`,
          // Without an address there is no account to protect; the per-address limit still applies.
          skip: (req) => accountOf(req.body) === '',
        }
      : {}),
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, _res, next) => {
      next(
        new AppError(
          'too-many-requests',
          `Too many ${what} attempts ${per === 'account' ? 'for this account' : 'from this address'}; wait ${Math.ceil(setting.windowMs / 60000)} minutes and try again.`,
        ),
      );
    },
  });
}

function accountOf(body: unknown): string {
  const email = typeof body === 'object' && body !== null ? (body as { email?: unknown }).email : undefined;
  return typeof email === 'string' ? email.trim().toLowerCase() : '';
}

/** The scheme, host and port of a tile template (its placeholders are only in the path). */
function tileOrigin(template: string): string {
  return new URL(template.replace(/\{[zxy]\}/g, '0')).origin;
}

function chain(first: RequestHandler, second: RequestHandler): RequestHandler {
  return (req, res, next) => {
    first(req, res, (error?: unknown) => (error ? next(error) : second(req, res, next)));
  };
}

/** Builds the Express app: the versioned API under `/api/v1`, its docs, the web site beside it. */
export function buildApp(deps: AppDependencies): BuiltApp {
  const logger = deps.logger ?? createLogger('info');
  const ctx: ServiceContext = {
    users: createKnexUserStore(deps.db),
    tokens: createKnexApiTokenStore(deps.db),
    activity: createKnexActivityStore(deps.db),
    links: createKnexEmailLinkStore(deps.db),
    health: deps.healthStore ?? createKnexHealthStore(deps.db),
    mailer: deps.mailer,
    publicUrl: deps.publicUrl.replace(/\/+$/, ''),
    now: deps.now ?? (() => new Date()),
  };
  // Common practice for sign-in throttling: a handful of attempts per address per quarter hour.
  const signInSetting = deps.rateLimits?.signIn ?? { windowMs: 15 * 60_000, limit: 10 };
  const resetSetting = deps.rateLimits?.reset ?? { windowMs: 15 * 60_000, limit: 10 };
  const signInByAddress = limiter(signInSetting, 'sign-in');
  const signInByAccount = limiter(signInSetting, 'sign-in', 'account');
  const resetByAddress = limiter(resetSetting, 'password-reset or invitation');
  const resetByAccount = limiter(resetSetting, 'password-reset', 'account');
  const limits = {
    signIn: chain(signInByAddress, signInByAccount),
    reset: resetByAddress,
    resetRequest: chain(resetByAddress, resetByAccount),
  };

  const archive: DiveDeps = {
    projects: createKnexProjectStore(deps.db),
    logs: createKnexLogStore(deps.db),
    runs: createKnexProcessingRunStore(deps.db),
    dives: createKnexDiveStore(deps.db),
    activity: ctx.activity,
    queue: deps.processingQueue,
    now: ctx.now,
    trackCache: new RenderCache(64 * 1024 * 1024),
    membership: {
      roleOf: (organisationId, userId) => ctx.users.roleOf(organisationId, userId),
      tokenBelongsTo: async (organisationId, tokenId) =>
        (await ctx.tokens.findById(organisationId, tokenId)) !== undefined,
    },
  };
  const routes: RouteSpec[] = [
    ...createHealthRoutes({ healthStore: ctx.health }),
    ...createAuthRoutes(ctx, limits),
    ...createOrganisationRoutes(ctx),
    ...createMemberRoutes(ctx),
    ...createInvitationRoutes(ctx, limits),
    ...createApiTokenRoutes(ctx),
    ...createProjectRoutes(ctx, {
      projects: archive.projects,
      logs: archive.logs,
      onLogCreated: (log, input) => queueLogProcessing(archive, { ...input, projectId: log.projectId, logId: log.id }),
    }),
    ...createDiveRoutes(archive),
    ...createConvertRoutes(ctx.now),
    ...createCrsRoutes(),
    ...createSiteSettingsRoutes({ tileUrl: deps.tileUrl ?? null, tileAttribution: deps.tileAttribution ?? null }),
    ...(deps.fakeMailbox === undefined ? [] : createMailboxRoutes(deps.fakeMailbox)),
  ];
  let openApi: unknown;
  routes.push(
    defineRoute({
      method: 'get',
      path: '/openapi.json',
      summary: 'This API as an OpenAPI 3.1 document, generated from the route table',
      tag: 'Health',
      access: 'public',
      responses: { 200: { description: 'The OpenAPI document' } },
      handler(_input, _req, res) {
        openApi ??= buildOpenApiDocument(routes, { version: LEADLINE_VERSION });
        res.json(openApi);
      },
    }),
  );

  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');
  app.use(createRequestLogger(logger));
  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: true,
        directives: {
          // Everything the site needs ships with it: no outside host, not even for fonts.
          'default-src': ["'self'"],
          // The configured tile server, and only it, may serve images (the optional background map).
          'img-src': ["'self'", 'data:', 'blob:', ...(deps.tileUrl === undefined ? [] : [tileOrigin(deps.tileUrl)])],
          'font-src': ["'self'", 'data:'],
          'upgrade-insecure-requests': null,
        },
      },
    }),
  );

  const api = express.Router();
  api.use(express.json({ limit: '1mb' }));
  const sessions = session({
    name: SESSION_COOKIE,
    store: deps.sessionStore,
    secret: deps.sessionSecret,
    resave: false,
    saveUninitialized: false,
    rolling: true,
    cookie: {
      httpOnly: true,
      sameSite: 'lax',
      secure: deps.cookieSecure ?? false,
      path: '/',
      maxAge: 7 * 24 * 3600 * 1000,
    },
  });
  // A read with an API token never touches the session (authentication goes by the token alone), so
  // it skips the session's per-request work.
  api.use((req, res, next) => {
    if ((req.method === 'GET' || req.method === 'HEAD') && /^bearer\s/i.test(req.headers.authorization ?? '')) next();
    else sessions(req, res, next);
  });
  api.use(
    mountRoutes(routes, {
      users: ctx.users,
      authenticateToken: (token) => authenticateApiToken(ctx, token),
      uploadLimitBytes: deps.uploadLimitBytes ?? 100 * 1024 * 1024,
    }),
  );
  api.use(notFoundHandler);
  app.use('/api/v1', api);
  app.use('/api/docs', createDocsRouter());
  app.use('/api', notFoundHandler);

  if (deps.webDist !== undefined && existsSync(join(deps.webDist, 'index.html'))) {
    const webDist = deps.webDist;
    app.use(express.static(webDist, { index: false, maxAge: '1h' }));
    app.get('/{*splat}', (_req, res) => {
      res.sendFile(join(webDist, 'index.html'));
    });
  }

  app.use(createErrorHandler((message) => logger.error(message)));
  return { app, routes };
}

/** Builds the Express app (see `buildApp`). */
export function createApp(deps: AppDependencies): Express {
  return buildApp(deps).app;
}
