import { AppError } from '../http/errors.js';
import type { Mailer } from '../mail/mailer.js';
import type { ActivityStore } from '../stores/activity-store.js';
import type { EmailLinkRecord, EmailLinkStore } from '../stores/email-link-store.js';
import type { UserStore } from '../stores/user-store.js';
import { hashPassword } from './password.js';
import type { Role } from './roles.js';
import { createSecret, hashSecret } from './secrets.js';

/** How long an invitation link stays valid. */
export const INVITATION_LIFETIME_MS = 7 * 24 * 3600 * 1000;

interface Deps {
  users: UserStore;
  links: EmailLinkStore;
  activity: ActivityStore;
  mailer: Mailer;
  publicUrl: string;
  now: () => Date;
}

/** Invites an address into an organisation with a role: a single-use link valid for seven days, sent by e-mail. */
export async function inviteMember(
  deps: Deps,
  input: { organisationId: string; organisationName: string; email: string; role: Role; invitedBy: string },
): Promise<EmailLinkRecord> {
  const existing = await deps.users.findUserByEmail(input.email);
  if (existing !== undefined && (await deps.users.roleOf(input.organisationId, existing.id)) !== undefined)
    throw new AppError('conflict', `${input.email} is already a member of this organisation.`);
  const secret = createSecret();
  const link = await deps.links.create({
    kind: 'invitation',
    secretHash: hashSecret(secret),
    email: input.email,
    organisationId: input.organisationId,
    role: input.role,
    createdBy: input.invitedBy,
    expiresAt: new Date(deps.now().getTime() + INVITATION_LIFETIME_MS),
  });
  const url = `${deps.publicUrl}/accept-invitation?token=${encodeURIComponent(secret)}`;
  await deps.mailer.send({
    to: input.email,
    subject: `You are invited to ${input.organisationName} on Leadline`,
    text: [
      `You have been invited to join ${input.organisationName} on Leadline as ${input.role}.`,
      '',
      `Accept the invitation here (the link works once and expires in 7 days):`,
      url,
      '',
      'If you did not expect this, ignore this message.',
    ].join('\n'),
  });
  await deps.activity.append({
    organisationId: input.organisationId,
    actorUserId: input.invitedBy,
    action: 'invitation-sent',
    subjectType: 'invitation',
    subjectId: link.id,
    details: { email: input.email, role: input.role },
  });
  return link;
}

/**
 * Accepts an invitation: adds the membership, creating the user when the address is new (then a display
 * name and password are required). 410-like failures (used, expired, unknown) answer 404.
 */
export async function acceptInvitation(
  deps: Deps,
  input: { token: string; displayName?: string | undefined; password?: string | undefined },
): Promise<{ userId: string; organisationId: string; role: Role }> {
  const secretHash = hashSecret(input.token);
  const expired = 'This invitation link is unknown, already used or expired; ask for a new one.';
  const found = await deps.links.findUsable('invitation', secretHash, deps.now());
  if (found === undefined) throw new AppError('not-found', expired);
  let user = await deps.users.findUserByEmail(found.email);
  // Check what a new account needs before using the link up, so a missing field does not waste it.
  const { displayName, password } = input;
  const newAccount = displayName !== undefined && password !== undefined ? { displayName, password } : undefined;
  if (user === undefined && newAccount === undefined)
    throw new AppError('unprocessable', 'A new account needs a display name and a password.', {
      fields: ['displayName', 'password'],
    });
  const link = await deps.links.consume('invitation', secretHash, deps.now());
  if (link === undefined || link.organisationId === null || link.role === null)
    throw new AppError('not-found', expired);
  if (user === undefined && newAccount !== undefined) {
    const created = await deps.users.createUser({
      email: link.email,
      displayName: newAccount.displayName,
      passwordHash: await hashPassword(newAccount.password),
    });
    user = { ...created, passwordHash: null };
  }
  if (user === undefined) throw new AppError('unprocessable', 'A new account needs a display name and a password.');
  await deps.users.addMembership(link.organisationId, user.id, link.role);
  await deps.activity.append({
    organisationId: link.organisationId,
    actorUserId: user.id,
    action: 'invitation-accepted',
    subjectType: 'invitation',
    subjectId: link.id,
    details: { role: link.role },
  });
  return { userId: user.id, organisationId: link.organisationId, role: link.role };
}

/** Pending (unused, unexpired) invitations of an organisation. */
export function listPendingInvitations(deps: Deps, organisationId: string): Promise<EmailLinkRecord[]> {
  return deps.links.listPendingInvitations(organisationId, deps.now());
}

/** Withdraws a pending invitation: its link stops working at once. Unknown, used or expired ones answer 404. */
export async function revokeInvitation(
  deps: Deps,
  input: { organisationId: string; invitationId: string; actorUserId: string },
): Promise<EmailLinkRecord> {
  const link = await deps.links.revokeInvitation(input.organisationId, input.invitationId, deps.now());
  if (link === undefined)
    throw new AppError('not-found', 'No pending invitation with this id: it may have been accepted or have expired.');
  await deps.activity.append({
    organisationId: input.organisationId,
    actorUserId: input.actorUserId,
    action: 'invitation-revoked',
    subjectType: 'invitation',
    subjectId: link.id,
    details: { email: link.email },
  });
  return link;
}
