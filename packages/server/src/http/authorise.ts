import type { Request } from 'express';
import type { TokenIdentity } from '../services/api-token-service.js';
import { roleAllows } from '../services/roles.js';
import type { UserStore } from '../stores/user-store.js';
import { AppError } from './errors.js';
import { type AuthContext, isStateChanging, type RouteSpec } from './route-table.js';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** The caller as authentication found them, before the route's rules are applied. */
export type Caller =
  | { kind: 'anonymous' }
  | { kind: 'session'; userId: string }
  | { kind: 'token'; identity: TokenIdentity }
  | { kind: 'bad-token' };

/** Applies a route's access rule to a caller; throws 401 or 403 with a reason, returns the context otherwise. */
export async function authorise(
  route: RouteSpec,
  caller: Caller,
  req: Request,
  users: UserStore,
): Promise<AuthContext> {
  const anonymous: AuthContext = { userId: null, via: null, tokenId: null, organisationId: null, role: null };
  if (route.access === 'public') {
    if (caller.kind === 'session') return { ...anonymous, userId: caller.userId, via: 'session' };
    return anonymous;
  }
  if (caller.kind === 'anonymous') throw new AppError('unauthenticated', 'Sign in or send an API token.');
  if (caller.kind === 'bad-token')
    throw new AppError('unauthenticated', 'The API token is unknown, revoked or expired.');

  if (caller.kind === 'token') {
    if (route.sessionOnly)
      throw new AppError('forbidden', 'This route needs a signed-in browser session; API tokens cannot use it.');
    if (caller.identity.scope === 'read' && isStateChanging(route.method))
      throw new AppError('forbidden', 'This API token is read-only.');
  }
  const userId = caller.kind === 'session' ? caller.userId : caller.identity.userId;
  const base: AuthContext = {
    userId,
    via: caller.kind,
    tokenId: caller.kind === 'token' ? caller.identity.tokenId : null,
    organisationId: null,
    role: null,
  };
  if (route.access === 'signed-in') return base;
  if (route.access === 'any-admin') {
    if (caller.kind === 'token') {
      if (caller.identity.role !== 'admin') throw new AppError('forbidden', 'Only an admin may do this.');
      return base;
    }
    const memberships = await users.membershipsOf(userId);
    if (!memberships.some((m) => m.role === 'admin')) throw new AppError('forbidden', 'Only an admin may do this.');
    return base;
  }

  const organisationId = req.params.organisationId;
  if (typeof organisationId !== 'string' || !UUID.test(organisationId))
    throw new AppError('not-found', `No organisation ${String(organisationId)}.`);
  let role: AuthContext['role'];
  if (caller.kind === 'token') {
    if (caller.identity.organisationId !== organisationId)
      throw new AppError('forbidden', 'This API token belongs to another organisation.');
    role = caller.identity.role;
  } else {
    role = (await users.roleOf(organisationId, userId)) ?? null;
    if (role === null) throw new AppError('forbidden', 'You are not a member of this organisation.');
  }
  if (!roleAllows(role, route.access))
    throw new AppError('forbidden', `This needs the ${route.access} role or above; you act as ${role}.`);
  return { ...base, organisationId, role };
}

/** The caller's user id; for handlers of routes that are not public. */
export function requireUserId(auth: AuthContext): string {
  if (auth.userId === null) throw new AppError('unauthenticated', 'Sign in or send an API token.');
  return auth.userId;
}

/** The caller's organisation and role; for handlers of member routes. */
export function requireMembership(auth: AuthContext): {
  userId: string;
  organisationId: string;
  role: NonNullable<AuthContext['role']>;
} {
  if (auth.userId === null || auth.organisationId === null || auth.role === null)
    throw new AppError('forbidden', 'You are not a member of this organisation.');
  return { userId: auth.userId, organisationId: auth.organisationId, role: auth.role };
}
