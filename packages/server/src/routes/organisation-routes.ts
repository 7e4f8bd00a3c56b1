import { z } from 'zod';
import { requireMembership, requireUserId } from '../http/authorise.js';
import { defineRoute, type RouteSpec } from '../http/route-table.js';
import { createOrganisation, getOrganisation } from '../services/organisation-service.js';
import type { ServiceContext } from '../services/service-context.js';
import { OrganisationParams, RoleSchema, TimestampSchema, UuidSchema } from './schemas.js';

const OrganisationSchema = z.object({ id: UuidSchema, name: z.string(), slug: z.string(), createdAt: TimestampSchema });
const NameSchema = z.string().trim().min(1).max(200);

/** Organisations: create one (its creator becomes admin), read and rename it. */
export function createOrganisationRoutes(ctx: ServiceContext): RouteSpec[] {
  return [
    defineRoute({
      method: 'post',
      path: '/organisations',
      summary: 'Create an organisation; you become its admin',
      tag: 'Organisations',
      access: 'signed-in',
      sessionOnly: true,
      body: z.object({
        name: NameSchema,
        slug: z
          .string()
          .regex(/^[a-z0-9](?:[a-z0-9-]{0,48}[a-z0-9])?$/, 'lower-case letters, digits and inner hyphens, up to 50')
          .describe('A short unique name, e.g. hollowtide'),
      }),
      responses: {
        201: { description: 'Created', schema: z.object({ organisation: OrganisationSchema }) },
        409: { description: 'The short name is taken' },
      },
      async handler({ body, auth }, _req, res) {
        const organisation = await createOrganisation(ctx, { ...body, userId: requireUserId(auth) });
        res.status(201).json({ organisation });
      },
    }),
    defineRoute({
      method: 'get',
      path: '/organisations/:organisationId',
      summary: 'The organisation and your role in it',
      tag: 'Organisations',
      access: 'viewer',
      params: OrganisationParams,
      responses: {
        200: {
          description: 'The organisation',
          schema: z.object({ organisation: OrganisationSchema, role: RoleSchema }),
        },
      },
      async handler({ auth }, _req, res) {
        const me = requireMembership(auth);
        res.json({ organisation: await getOrganisation(ctx, me.organisationId), role: me.role });
      },
    }),
    defineRoute({
      method: 'patch',
      path: '/organisations/:organisationId',
      summary: 'Rename the organisation',
      tag: 'Organisations',
      access: 'admin',
      params: OrganisationParams,
      body: z.object({ name: NameSchema }),
      responses: { 200: { description: 'Renamed', schema: z.object({ organisation: OrganisationSchema }) } },
      async handler({ body, auth }, _req, res) {
        const me = requireMembership(auth);
        await ctx.users.renameOrganisation(me.organisationId, body.name);
        res.json({ organisation: await getOrganisation(ctx, me.organisationId) });
      },
    }),
  ];
}
