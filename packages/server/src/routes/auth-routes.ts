import type { Request, RequestHandler } from 'express';
import { z } from 'zod';
import { requireUserId } from '../http/authorise.js';
import { defineRoute, type RouteSpec } from '../http/route-table.js';
import { changePassword, getCurrentUser, signIn } from '../services/auth-service.js';
import type { ServiceContext } from '../services/service-context.js';
import { CurrentUserSchema, EmailSchema, PasswordSchema } from './schemas.js';

/** Starts a fresh session for a user (a new id, so a planted session id is worthless). */
export function startSession(req: Request, userId: string): Promise<void> {
  return new Promise((resolve, reject) => {
    req.session.regenerate((error: unknown) => {
      if (error) return reject(error);
      req.session.userId = userId;
      req.session.save((saveError: unknown) => (saveError ? reject(saveError) : resolve()));
    });
  });
}

/** Sign-in, sign-out and the current user. */
export function createAuthRoutes(ctx: ServiceContext, limits: { signIn: RequestHandler }): RouteSpec[] {
  return [
    defineRoute({
      method: 'post',
      path: '/session',
      summary: 'Sign in with e-mail and password; sets the session cookie',
      tag: 'Sign-in',
      access: 'public',
      before: [limits.signIn],
      body: z.object({ email: EmailSchema, password: z.string().min(1).max(200) }),
      responses: { 200: { description: 'Signed in', schema: CurrentUserSchema } },
      async handler({ body }, req, res) {
        const user = await signIn(ctx, body.email, body.password);
        await startSession(req, user.id);
        res.json(await getCurrentUser(ctx, user.id));
      },
    }),
    defineRoute({
      method: 'delete',
      path: '/session',
      summary: 'Sign out; ends the session',
      tag: 'Sign-in',
      access: 'signed-in',
      sessionOnly: true,
      responses: { 204: { description: 'Signed out' } },
      async handler({ auth }, req, res) {
        const userId = requireUserId(auth);
        await new Promise<void>((resolve, reject) =>
          req.session.destroy((error: unknown) => (error ? reject(error) : resolve())),
        );
        await ctx.activity.append({ actorUserId: userId, action: 'sign-out', subjectType: 'user', subjectId: userId });
        res.clearCookie('leadline.sid', { path: '/' });
        res.status(204).end();
      },
    }),
    defineRoute({
      method: 'get',
      path: '/me',
      summary: 'The signed-in user with every organisation and role',
      tag: 'Sign-in',
      access: 'signed-in',
      responses: { 200: { description: 'The current user', schema: CurrentUserSchema } },
      async handler({ auth }, _req, res) {
        res.json(await getCurrentUser(ctx, requireUserId(auth)));
      },
    }),
    defineRoute({
      method: 'put',
      path: '/me/password',
      summary: 'Change your password (the current one is required)',
      tag: 'Sign-in',
      access: 'signed-in',
      sessionOnly: true,
      before: [limits.signIn],
      body: z.object({ currentPassword: z.string().min(1).max(200), newPassword: PasswordSchema }),
      responses: { 204: { description: 'Changed' } },
      async handler({ auth, body }, _req, res) {
        await changePassword(ctx, { userId: requireUserId(auth), ...body });
        res.status(204).end();
      },
    }),
  ];
}
