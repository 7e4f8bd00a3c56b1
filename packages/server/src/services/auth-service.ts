import { AppError } from '../http/errors.js';
import type { ActivityStore } from '../stores/activity-store.js';
import type { MembershipRecord, UserRecord, UserStore } from '../stores/user-store.js';
import { hashPassword, verifyPassword } from './password.js';

/** The signed-in user with every organisation and role. */
export interface CurrentUser {
  user: UserRecord;
  memberships: MembershipRecord[];
}

let dummyHash: Promise<string> | undefined;

/** Checks e-mail and password; records the attempt in the activity trail; throws 401 on a mismatch. */
export async function signIn(
  deps: { users: UserStore; activity: ActivityStore },
  email: string,
  password: string,
): Promise<UserRecord> {
  const found = await deps.users.findUserByEmail(email);
  // Verify against a throwaway hash when the user is unknown, so the answer takes as long either way.
  dummyHash ??= hashPassword('leadline-no-such-user');
  const storedHash = found?.passwordHash ?? (await dummyHash);
  const ok = await verifyPassword(storedHash, password);
  if (found === undefined || found.passwordHash === null || !ok) {
    await deps.activity.append({
      actorUserId: found?.id ?? null,
      action: 'sign-in-failed',
      details: { email },
    });
    throw new AppError('unauthenticated', 'The e-mail address or the password is wrong.');
  }
  await deps.activity.append({ actorUserId: found.id, action: 'sign-in', subjectType: 'user', subjectId: found.id });
  const { passwordHash: _hash, ...user } = found;
  return user;
}

/** The user behind a session or token, with organisations and roles; 401 when the user is gone. */
export async function getCurrentUser(deps: { users: UserStore }, userId: string): Promise<CurrentUser> {
  const user = await deps.users.findUserById(userId);
  if (user === undefined) throw new AppError('unauthenticated', 'The signed-in user no longer exists.');
  return { user, memberships: await deps.users.membershipsOf(userId) };
}

/** Changes a signed-in user's password after checking the current one; 401 when it is wrong. */
export async function changePassword(
  deps: { users: UserStore; activity: ActivityStore },
  input: { userId: string; currentPassword: string; newPassword: string },
): Promise<void> {
  const current = await deps.users.findUserById(input.userId);
  const found = current === undefined ? undefined : await deps.users.findUserByEmail(current.email);
  if (
    found === undefined ||
    found.passwordHash === null ||
    !(await verifyPassword(found.passwordHash, input.currentPassword))
  )
    throw new AppError('unauthenticated', 'The current password is wrong.');
  await deps.users.setPasswordHash(found.id, await hashPassword(input.newPassword));
  await deps.activity.append({
    actorUserId: found.id,
    action: 'password-changed',
    subjectType: 'user',
    subjectId: found.id,
  });
}
