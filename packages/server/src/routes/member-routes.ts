import { z } from 'zod';
import { requireMembership } from '../http/authorise.js';
import { defineRoute, type RouteSpec } from '../http/route-table.js';
import { changeRole, listMembers, removeMember } from '../services/member-service.js';
import type { ServiceContext } from '../services/service-context.js';
import { OrganisationParams, RoleSchema, TimestampSchema, UuidSchema } from './schemas.js';

const MemberSchema = z.object({
  userId: UuidSchema,
  email: z.string(),
  displayName: z.string(),
  role: RoleSchema,
  joinedAt: TimestampSchema,
});
const MemberParams = OrganisationParams.extend({ userId: UuidSchema });

const ActivitySchema = z.object({
  id: z.string(),
  organisationId: UuidSchema.nullable(),
  actorUserId: UuidSchema.nullable(),
  action: z.string(),
  subjectType: z.string().nullable(),
  subjectId: z.string().nullable(),
  details: z.record(z.string(), z.unknown()),
  createdAt: TimestampSchema,
});

/** Members of an organisation and its activity trail (admins). */
export function createMemberRoutes(ctx: ServiceContext): RouteSpec[] {
  return [
    defineRoute({
      method: 'get',
      path: '/organisations/:organisationId/members',
      summary: "The organisation's members and their roles",
      tag: 'Members',
      access: 'admin',
      params: OrganisationParams,
      responses: { 200: { description: 'Members by name', schema: z.object({ members: z.array(MemberSchema) }) } },
      async handler({ auth }, _req, res) {
        res.json({ members: await listMembers(ctx, requireMembership(auth).organisationId) });
      },
    }),
    defineRoute({
      method: 'patch',
      path: '/organisations/:organisationId/members/:userId',
      summary: "Change a member's role",
      tag: 'Members',
      access: 'admin',
      params: MemberParams,
      body: z.object({ role: RoleSchema }),
      responses: { 204: { description: 'Changed' }, 409: { description: 'It would leave no admin' } },
      async handler({ params, body, auth }, _req, res) {
        const me = requireMembership(auth);
        await changeRole(ctx, {
          organisationId: me.organisationId,
          userId: params.userId,
          role: body.role,
          actorUserId: me.userId,
        });
        res.status(204).end();
      },
    }),
    defineRoute({
      method: 'delete',
      path: '/organisations/:organisationId/members/:userId',
      summary: 'Remove a member from the organisation',
      tag: 'Members',
      access: 'admin',
      params: MemberParams,
      responses: { 204: { description: 'Removed' }, 409: { description: 'It would leave no admin' } },
      async handler({ params, auth }, _req, res) {
        const me = requireMembership(auth);
        await removeMember(ctx, { organisationId: me.organisationId, userId: params.userId, actorUserId: me.userId });
        res.status(204).end();
      },
    }),
    defineRoute({
      method: 'get',
      path: '/organisations/:organisationId/activity',
      summary: 'The activity trail: who did what, newest first',
      tag: 'Members',
      access: 'admin',
      params: OrganisationParams,
      query: z.object({
        limit: z.coerce.number().int().min(1).max(500).default(100),
        before: z.string().regex(/^\d+$/, 'before is the id of an entry').optional(),
      }),
      responses: { 200: { description: 'Entries', schema: z.object({ activity: z.array(ActivitySchema) }) } },
      async handler({ query, auth }, _req, res) {
        const { organisationId } = requireMembership(auth);
        const activity = await ctx.activity.list({
          organisationId,
          limit: query.limit,
          ...(query.before === undefined ? {} : { before: query.before }),
        });
        res.json({ activity });
      },
    }),
  ];
}
