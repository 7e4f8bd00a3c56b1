import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api-client';
import { memberKeys } from './keys';
import type { Role } from './list-members';

/** An invitation not yet accepted and not expired. */
export interface Invitation {
  id: string;
  email: string;
  role: Role | null;
  expiresAt: string;
  createdAt: string;
}

export async function listInvitations(organisationId: string): Promise<Invitation[]> {
  const body = await apiFetch<{ invitations: Invitation[] }>(`/organisations/${organisationId}/invitations`);
  return body.invitations;
}

export function invitationsQueryOptions(organisationId: string) {
  return queryOptions({
    queryKey: memberKeys.invitations(organisationId),
    queryFn: () => listInvitations(organisationId),
  });
}

export function useInvitations(organisationId: string) {
  return useQuery(invitationsQueryOptions(organisationId));
}
