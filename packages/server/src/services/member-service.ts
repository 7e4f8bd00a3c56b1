import { AppError } from '../http/errors.js';
import type { ActivityStore } from '../stores/activity-store.js';
import type { MemberRecord, UserStore } from '../stores/user-store.js';
import type { Role } from './roles.js';

interface Deps {
  users: UserStore;
  activity: ActivityStore;
}

/** Members of an organisation, by name. */
export function listMembers(deps: Deps, organisationId: string): Promise<MemberRecord[]> {
  return deps.users.listMembers(organisationId);
}

async function requireMember(deps: Deps, organisationId: string, userId: string): Promise<Role> {
  const role = await deps.users.roleOf(organisationId, userId);
  if (role === undefined) throw new AppError('not-found', `User ${userId} is not a member of this organisation.`);
  return role;
}

/** Changes a member's role; 409 when it would leave the organisation without an admin. */
export async function changeRole(
  deps: Deps,
  input: { organisationId: string; userId: string; role: Role; actorUserId: string },
): Promise<void> {
  const previous = await requireMember(deps, input.organisationId, input.userId);
  if (previous === input.role) return;
  if (previous === 'admin' && (await deps.users.countAdmins(input.organisationId)) <= 1)
    throw new AppError('conflict', 'This is the last admin of the organisation; make someone else admin first.');
  await deps.users.setRole(input.organisationId, input.userId, input.role);
  await deps.activity.append({
    organisationId: input.organisationId,
    actorUserId: input.actorUserId,
    action: 'role-changed',
    subjectType: 'user',
    subjectId: input.userId,
    details: { from: previous, to: input.role },
  });
}

/** Removes a member; 409 for the last admin. */
export async function removeMember(
  deps: Deps,
  input: { organisationId: string; userId: string; actorUserId: string },
): Promise<void> {
  const role = await requireMember(deps, input.organisationId, input.userId);
  if (role === 'admin' && (await deps.users.countAdmins(input.organisationId)) <= 1)
    throw new AppError('conflict', 'This is the last admin of the organisation; make someone else admin first.');
  await deps.users.removeMembership(input.organisationId, input.userId);
  await deps.activity.append({
    organisationId: input.organisationId,
    actorUserId: input.actorUserId,
    action: 'member-removed',
    subjectType: 'user',
    subjectId: input.userId,
    details: { role },
  });
}
