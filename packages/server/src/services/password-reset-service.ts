import { AppError } from '../http/errors.js';
import type { Mailer } from '../mail/mailer.js';
import type { ActivityStore } from '../stores/activity-store.js';
import type { EmailLinkStore } from '../stores/email-link-store.js';
import type { UserStore } from '../stores/user-store.js';
import { hashPassword } from './password.js';
import { createSecret, hashSecret } from './secrets.js';

/** How long a password-reset link stays valid. */
export const PASSWORD_RESET_LIFETIME_MS = 3600 * 1000;

interface Deps {
  users: UserStore;
  links: EmailLinkStore;
  activity: ActivityStore;
  mailer: Mailer;
  publicUrl: string;
  now: () => Date;
}

/** Sends a reset link when the address belongs to a user; says nothing either way, so addresses cannot be probed. */
export async function requestPasswordReset(deps: Deps, email: string): Promise<void> {
  const user = await deps.users.findUserByEmail(email);
  if (user === undefined) return;
  const secret = createSecret();
  await deps.links.create({
    kind: 'password-reset',
    secretHash: hashSecret(secret),
    email: user.email,
    expiresAt: new Date(deps.now().getTime() + PASSWORD_RESET_LIFETIME_MS),
  });
  await deps.mailer.send({
    to: user.email,
    subject: 'Reset your Leadline password',
    text: [
      `Someone asked to reset the Leadline password of ${user.email}.`,
      '',
      'Choose a new password here (the link works once and expires in 1 hour):',
      `${deps.publicUrl}/reset-password?token=${encodeURIComponent(secret)}`,
      '',
      'If it was not you, ignore this message; your password stays as it is.',
    ].join('\n'),
  });
}

/** Sets a new password through a reset link and ends every session of that user. */
export async function completePasswordReset(deps: Deps, input: { token: string; password: string }): Promise<void> {
  const link = await deps.links.consume('password-reset', hashSecret(input.token), deps.now());
  if (link === undefined)
    throw new AppError('not-found', 'This reset link is unknown, already used or expired; ask for a new one.');
  const user = await deps.users.findUserByEmail(link.email);
  if (user === undefined) throw new AppError('not-found', 'The account of this reset link no longer exists.');
  await deps.users.setPasswordHash(user.id, await hashPassword(input.password));
  await deps.users.deleteSessionsOfUser(user.id);
  await deps.activity.append({
    actorUserId: user.id,
    action: 'password-reset',
    subjectType: 'user',
    subjectId: user.id,
  });
}
