import { AppError } from '../http/errors.js';
import type { UserStore } from '../stores/user-store.js';

/** An organisation as the API shows it. */
export interface OrganisationView {
  id: string;
  name: string;
  slug: string;
  createdAt: Date;
}

/** One organisation; 404 when it is gone. */
export async function getOrganisation(deps: { users: UserStore }, organisationId: string): Promise<OrganisationView> {
  const organisation = await deps.users.findOrganisation(organisationId);
  if (organisation === undefined) throw new AppError('not-found', `No organisation ${organisationId}.`);
  return organisation;
}

/** Creates an organisation with the caller as its first admin; 409 when the slug is taken. */
export async function createOrganisation(
  deps: { users: UserStore },
  input: { name: string; slug: string; userId: string },
): Promise<OrganisationView> {
  const created = await deps.users.createOrganisation({ name: input.name, slug: input.slug });
  if (created === undefined) throw new AppError('conflict', `The short name "${input.slug}" is taken; choose another.`);
  await deps.users.addMembership(created.id, input.userId, 'admin');
  return getOrganisation(deps, created.id);
}
