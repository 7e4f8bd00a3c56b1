import { z } from 'zod';
import { requireMembership } from '../http/authorise.js';
import { defineRoute, type RouteSpec } from '../http/route-table.js';
import { createApiToken, listApiTokens, revokeApiToken } from '../services/api-token-service.js';
import type { ServiceContext } from '../services/service-context.js';
import type { ApiTokenRecord } from '../stores/api-token-store.js';
import { OrganisationParams, TimestampSchema, UuidSchema } from './schemas.js';

const TokenSchema = z.object({
  id: UuidSchema,
  userId: UuidSchema,
  name: z.string(),
  displayPrefix: z.string().describe('The first characters of the token, to recognise it'),
  scope: z.enum(['read', 'read-write']),
  expiresAt: TimestampSchema.nullable(),
  lastUsedAt: TimestampSchema.nullable(),
  revokedAt: TimestampSchema.nullable(),
  createdAt: TimestampSchema,
});

function toJson(record: ApiTokenRecord) {
  const { organisationId: _organisationId, ...rest } = record;
  return rest;
}

/** API tokens for pipelines. */
export function createApiTokenRoutes(ctx: ServiceContext): RouteSpec[] {
  return [
    defineRoute({
      method: 'post',
      path: '/organisations/:organisationId/tokens',
      summary: 'Create an API token for yourself; the secret is in this answer only',
      tag: 'API tokens',
      access: 'viewer',
      sessionOnly: true,
      params: OrganisationParams,
      body: z.object({
        name: z.string().trim().min(1).max(100),
        scope: z.enum(['read', 'read-write']).describe('A viewer may create read tokens only'),
        expiresInDays: z.number().int().min(1).max(3650).nullable().default(90).describe('null: never expires'),
      }),
      responses: {
        201: {
          description: 'Created',
          schema: z.object({ token: z.string().describe('llt_…, shown once'), apiToken: TokenSchema }),
        },
      },
      async handler({ body, auth }, _req, res) {
        const me = requireMembership(auth);
        const expiresAt =
          body.expiresInDays === null ? null : new Date(ctx.now().getTime() + body.expiresInDays * 86_400_000);
        const { token, record } = await createApiToken(ctx, { ...me, name: body.name, scope: body.scope, expiresAt });
        res.status(201).json({ token, apiToken: toJson(record) });
      },
    }),
    defineRoute({
      method: 'get',
      path: '/organisations/:organisationId/tokens',
      summary: "Your tokens in this organisation (an admin sees everyone's)",
      tag: 'API tokens',
      access: 'viewer',
      params: OrganisationParams,
      responses: {
        200: { description: 'Tokens, newest first', schema: z.object({ apiTokens: z.array(TokenSchema) }) },
      },
      async handler({ auth }, _req, res) {
        const tokens = await listApiTokens(ctx, requireMembership(auth));
        res.json({ apiTokens: tokens.map(toJson) });
      },
    }),
    defineRoute({
      method: 'delete',
      path: '/organisations/:organisationId/tokens/:tokenId',
      summary: 'Revoke a token (your own; an admin any of the organisation)',
      tag: 'API tokens',
      access: 'viewer',
      params: OrganisationParams.extend({ tokenId: UuidSchema }),
      responses: { 200: { description: 'Revoked', schema: z.object({ apiToken: TokenSchema }) } },
      async handler({ params, auth }, _req, res) {
        const record = await revokeApiToken(ctx, { ...requireMembership(auth), tokenId: params.tokenId });
        res.json({ apiToken: toJson(record) });
      },
    }),
  ];
}
