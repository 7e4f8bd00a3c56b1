import type { RequestHandler } from 'express';
import { z } from 'zod';
import { requireMembership } from '../http/authorise.js';
import { defineRoute, type RouteSpec } from '../http/route-table.js';
import {
  acceptInvitation,
  inviteMember,
  listPendingInvitations,
  revokeInvitation,
} from '../services/invitation-service.js';
import { completePasswordReset, requestPasswordReset } from '../services/password-reset-service.js';
import type { ServiceContext } from '../services/service-context.js';
import { startSession } from './auth-routes.js';
import { EmailSchema, OrganisationParams, PasswordSchema, RoleSchema, TimestampSchema, UuidSchema } from './schemas.js';

const InvitationSchema = z.object({
  id: UuidSchema,
  email: z.string(),
  role: RoleSchema.nullable(),
  expiresAt: TimestampSchema,
  createdAt: TimestampSchema,
});

/** Invitations and password resets: single-use links sent by e-mail. */
export function createInvitationRoutes(
  ctx: ServiceContext,
  limits: { reset: RequestHandler; resetRequest: RequestHandler },
): RouteSpec[] {
  return [
    defineRoute({
      method: 'post',
      path: '/organisations/:organisationId/invitations',
      summary: 'Invite someone by e-mail with a role; the link works once and expires in 7 days',
      tag: 'Members',
      access: 'admin',
      params: OrganisationParams,
      body: z.object({ email: EmailSchema, role: RoleSchema }),
      responses: { 201: { description: 'Sent', schema: z.object({ invitation: InvitationSchema }) } },
      async handler({ body, auth }, _req, res) {
        const me = requireMembership(auth);
        const organisation = (await ctx.users.membershipsOf(me.userId)).find(
          (m) => m.organisationId === me.organisationId,
        );
        const link = await inviteMember(ctx, {
          organisationId: me.organisationId,
          organisationName: organisation?.organisationName ?? 'an organisation',
          email: body.email,
          role: body.role,
          invitedBy: me.userId,
        });
        res.status(201).json({
          invitation: {
            id: link.id,
            email: link.email,
            role: link.role,
            expiresAt: link.expiresAt,
            createdAt: link.createdAt,
          },
        });
      },
    }),
    defineRoute({
      method: 'get',
      path: '/organisations/:organisationId/invitations',
      summary: 'Invitations not yet accepted and not expired',
      tag: 'Members',
      access: 'admin',
      params: OrganisationParams,
      responses: { 200: { description: 'Pending', schema: z.object({ invitations: z.array(InvitationSchema) }) } },
      async handler({ auth }, _req, res) {
        const links = await listPendingInvitations(ctx, requireMembership(auth).organisationId);
        res.json({
          invitations: links.map((l) => ({
            id: l.id,
            email: l.email,
            role: l.role,
            expiresAt: l.expiresAt,
            createdAt: l.createdAt,
          })),
        });
      },
    }),
    defineRoute({
      method: 'delete',
      path: '/organisations/:organisationId/invitations/:invitationId',
      summary: 'Withdraw a pending invitation; its link stops working at once',
      tag: 'Members',
      access: 'admin',
      params: OrganisationParams.extend({ invitationId: UuidSchema }),
      responses: {
        204: { description: 'Withdrawn' },
        404: { description: 'No pending invitation with this id (accepted, expired or unknown)' },
      },
      async handler({ params, auth }, _req, res) {
        const me = requireMembership(auth);
        await revokeInvitation(ctx, {
          organisationId: me.organisationId,
          invitationId: params.invitationId,
          actorUserId: me.userId,
        });
        res.status(204).end();
      },
    }),
    defineRoute({
      method: 'post',
      path: '/invitations/accept',
      summary: 'Accept an invitation (a new address also chooses a display name and password); signs in',
      tag: 'Members',
      access: 'public',
      before: [limits.reset],
      body: z.object({
        token: z.string().min(1).max(200),
        displayName: z.string().trim().min(1).max(200).optional(),
        password: PasswordSchema.optional(),
      }),
      responses: {
        200: { description: 'Joined', schema: z.object({ organisationId: UuidSchema, role: RoleSchema }) },
        404: { description: 'The link is unknown, used or expired' },
        422: { description: 'A new account needs a display name and password' },
      },
      async handler({ body }, req, res) {
        const joined = await acceptInvitation(ctx, body);
        await startSession(req, joined.userId);
        res.json({ organisationId: joined.organisationId, role: joined.role });
      },
    }),
    defineRoute({
      method: 'post',
      path: '/password-reset',
      summary: 'Ask for a password-reset link by e-mail; the answer is the same whether the address is known or not',
      tag: 'Sign-in',
      access: 'public',
      before: [limits.resetRequest],
      body: z.object({ email: EmailSchema }),
      responses: { 202: { description: 'If the address is known, a link is on its way' } },
      async handler({ body }, _req, res) {
        await requestPasswordReset(ctx, body.email);
        res.status(202).end();
      },
    }),
    defineRoute({
      method: 'post',
      path: '/password-reset/complete',
      summary: 'Set a new password with a reset link; ends every session of that user',
      tag: 'Sign-in',
      access: 'public',
      before: [limits.reset],
      body: z.object({ token: z.string().min(1).max(200), password: PasswordSchema }),
      responses: {
        204: { description: 'Password changed' },
        404: { description: 'The link is unknown, used or expired' },
      },
      async handler({ body }, _req, res) {
        await completePasswordReset(ctx, body);
        res.status(204).end();
      },
    }),
  ];
}
