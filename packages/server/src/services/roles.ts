/** A member's role in one organisation, weakest first in `ROLES`. */
export type Role = 'viewer' | 'editor' | 'admin';

/** Every role, weakest first. */
export const ROLES = ['viewer', 'editor', 'admin'] as const satisfies readonly Role[];

/** Whether `held` is at least as strong as `required`. */
export function roleAllows(held: Role, required: Role): boolean {
  return ROLES.indexOf(held) >= ROLES.indexOf(required);
}

/** The weaker of two roles: what a token may do is capped by both its scope and its user's role. */
export function weakerRole(a: Role, b: Role): Role {
  return ROLES.indexOf(a) <= ROLES.indexOf(b) ? a : b;
}
