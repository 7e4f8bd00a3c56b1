import { type NextFunction, type Request, type Response, Router } from 'express';
import multer from 'multer';
import passport from 'passport';
import { Strategy as BearerStrategy } from 'passport-http-bearer';
import type { z } from 'zod';
import type { TokenIdentity } from '../services/api-token-service.js';
import type { UserStore } from '../stores/user-store.js';
import { authorise, type Caller } from './authorise.js';
import { checkSameOrigin } from './csrf.js';
import { AppError } from './errors.js';
import { createHashingStorage } from './hashing-storage.js';
import { isStateChanging, type RouteSpec } from './route-table.js';

declare module 'express-session' {
  interface SessionData {
    userId: string;
  }
}

/** What mounting needs: the user store (roles) and a way to resolve bearer tokens. */
export interface MountDependencies {
  users: UserStore;
  authenticateToken: (token: string) => Promise<TokenIdentity | undefined>;
  /** Upper bound of one uploaded file, bytes. */
  uploadLimitBytes: number;
}

/** Mounts every route of the table on a router, each behind authentication, CSRF check, authorisation and validation. */
export function mountRoutes(routes: readonly RouteSpec[], deps: MountDependencies): Router {
  const authenticator = new passport.Passport();
  authenticator.use(
    'bearer',
    new BearerStrategy((token, done) => {
      deps.authenticateToken(token).then(
        (identity) => done(null, identity ?? false),
        (error: unknown) => done(error),
      );
    }),
  );
  const resolveCaller = (req: Request, res: Response): Promise<Caller> =>
    new Promise((resolve, reject) => {
      const header = req.headers.authorization;
      if (header !== undefined && /^bearer\s/i.test(header)) {
        authenticator.authenticate('bearer', { session: false }, (error: unknown, identity: TokenIdentity | false) => {
          if (error) reject(error);
          else resolve(identity ? { kind: 'token', identity } : { kind: 'bad-token' });
        })(req, res, (error?: unknown) => (error ? reject(error) : resolve({ kind: 'bad-token' })));
        return;
      }
      if (header !== undefined)
        return reject(new AppError('unauthenticated', 'Only "Authorization: Bearer <token>" is understood.'));
      const userId = req.session?.userId;
      resolve(typeof userId === 'string' ? { kind: 'session', userId } : { kind: 'anonymous' });
    });

  const router = Router();
  for (const route of routes) {
    const upload =
      route.upload === undefined
        ? undefined
        : multer({
            storage: createHashingStorage(),
            defParamCharset: 'utf8',
            limits: { fileSize: deps.uploadLimitBytes, files: route.upload.maxFiles },
          }).array(route.upload.field, route.upload.maxFiles);

    const handle = async (req: Request, res: Response, next: NextFunction): Promise<void> => {
      const caller = await resolveCaller(req, res);
      // Browsers never add an Authorization header on their own (a cross-site page cannot without CORS),
      // so only cookie-borne requests need the check.
      const bearer = caller.kind === 'token' || caller.kind === 'bad-token';
      if (!bearer && isStateChanging(req.method)) checkSameOrigin(req);
      const auth = await authorise(route, caller, req, deps.users);
      const params = parse(route.params, req.params, 'path');
      const query = parse(route.query, req.query, 'query');
      let files: Express.Multer.File[] = [];
      if (upload !== undefined) {
        await new Promise<void>((resolve, reject) =>
          upload(req, res, (error?: unknown) => (error ? reject(error) : resolve())),
        );
        files = Array.isArray(req.files) ? req.files : [];
      }
      const body = parse(route.body, req.body, 'body');
      await route.handler({ params, query, body, auth, files }, req, res);
      if (!res.headersSent) next(new Error(`route ${route.method} ${route.path} sent no response`));
    };
    router[route.method](route.path, ...(route.before ?? []), handle);
  }
  return router;
}

function parse(schema: z.ZodType | undefined, value: unknown, where: 'path' | 'query' | 'body'): unknown {
  if (schema === undefined) return undefined;
  const result = schema.safeParse(value ?? (where === 'body' ? undefined : {}));
  if (result.success) return result.data;
  const issues = result.error.issues.map((issue) => ({
    in: where,
    path: issue.path.map(String).join('.'),
    message: issue.message,
  }));
  const first = issues[0];
  const summary = first === undefined ? '' : `: ${first.path === '' ? '' : `${first.path}: `}${first.message}`;
  throw new AppError('bad-request', `The request ${where} is not valid${summary}`, { issues });
}
