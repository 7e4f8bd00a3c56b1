import { AppError } from '../http/errors.js';
import type { ActivityStore } from '../stores/activity-store.js';
import type { ApiTokenRecord, ApiTokenStore, TokenScope } from '../stores/api-token-store.js';
import type { UserStore } from '../stores/user-store.js';
import { type Role, roleAllows, weakerRole } from './roles.js';
import { API_TOKEN_PREFIX, createSecret, hashSecret } from './secrets.js';

interface Deps {
  tokens: ApiTokenStore;
  users: UserStore;
  activity: ActivityStore;
  now: () => Date;
}

/** Who a valid token acts for, and the most it may do in its organisation. */
export interface TokenIdentity {
  tokenId: string;
  userId: string;
  organisationId: string;
  scope: TokenScope;
  /** The user's current role capped by the scope: a read token acts as a viewer at most. */
  role: Role;
}

/** Creates a token; the secret is returned once and only its hash is kept. Viewers may create read tokens only. */
export async function createApiToken(
  deps: Deps,
  input: {
    organisationId: string;
    userId: string;
    role: Role;
    name: string;
    scope: TokenScope;
    expiresAt: Date | null;
  },
): Promise<{ token: string; record: ApiTokenRecord }> {
  if (input.scope === 'read-write' && !roleAllows(input.role, 'editor'))
    throw new AppError('forbidden', 'A viewer may create read tokens only.');
  if (input.expiresAt !== null && input.expiresAt.getTime() <= deps.now().getTime())
    throw new AppError('unprocessable', 'The expiry must lie in the future.');
  const token = createSecret(API_TOKEN_PREFIX);
  const record = await deps.tokens.create({
    organisationId: input.organisationId,
    userId: input.userId,
    name: input.name,
    displayPrefix: token.slice(0, API_TOKEN_PREFIX.length + 6),
    secretHash: hashSecret(token),
    scope: input.scope,
    expiresAt: input.expiresAt,
  });
  await deps.activity.append({
    organisationId: input.organisationId,
    actorUserId: input.userId,
    action: 'token-created',
    subjectType: 'api-token',
    subjectId: record.id,
    details: { name: input.name, scope: input.scope },
  });
  return { token, record };
}

/** Tokens an admin sees (all of the organisation) or anyone else sees (their own). */
export function listApiTokens(
  deps: Deps,
  input: { organisationId: string; userId: string; role: Role },
): Promise<ApiTokenRecord[]> {
  return deps.tokens.list(input.organisationId, input.role === 'admin' ? undefined : input.userId);
}

/** Revokes a token: admins any of the organisation's, others their own; 404 for anything else. */
export async function revokeApiToken(
  deps: Deps,
  input: { organisationId: string; tokenId: string; userId: string; role: Role },
): Promise<ApiTokenRecord> {
  const record = await deps.tokens.findById(input.organisationId, input.tokenId);
  if (record === undefined || (input.role !== 'admin' && record.userId !== input.userId))
    throw new AppError('not-found', `No API token ${input.tokenId} that you may revoke.`);
  if (record.revokedAt === null) {
    const at = deps.now();
    await deps.tokens.revoke(record.id, at);
    await deps.activity.append({
      organisationId: input.organisationId,
      actorUserId: input.userId,
      action: 'token-revoked',
      subjectType: 'api-token',
      subjectId: record.id,
      details: { name: record.name, owner: record.userId },
    });
    return { ...record, revokedAt: at };
  }
  return record;
}

/** How fresh a token's "last used" time is kept, in ms. */
export const LAST_USED_RESOLUTION_MS = 60_000;

/** Resolves a presented token; `undefined` when unknown, revoked, expired or its user left the organisation. */
export async function authenticateApiToken(deps: Deps, token: string): Promise<TokenIdentity | undefined> {
  if (!token.startsWith(API_TOKEN_PREFIX)) return undefined;
  const record = await deps.tokens.findBySecretHash(hashSecret(token));
  const now = deps.now();
  if (record === undefined || record.revokedAt !== null) return undefined;
  if (record.expiresAt !== null && record.expiresAt.getTime() <= now.getTime()) return undefined;
  const role = record.memberRole;
  if (role === undefined) return undefined;
  // "Last used" is kept to the minute: writing it on every request would make every pipeline call a
  // row update, and concurrent calls with one token would queue on that row.
  if (record.lastUsedAt === null || now.getTime() - record.lastUsedAt.getTime() >= LAST_USED_RESOLUTION_MS) {
    await deps.tokens.markUsed(record.id, now);
  }
  return {
    tokenId: record.id,
    userId: record.userId,
    organisationId: record.organisationId,
    scope: record.scope,
    role: record.scope === 'read' ? weakerRole(role, 'viewer') : role,
  };
}
