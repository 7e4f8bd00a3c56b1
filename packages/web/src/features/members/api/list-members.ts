import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api-client';
import { memberKeys } from './keys';

/** A role in an organisation: viewer < editor < admin. */
export type Role = 'viewer' | 'editor' | 'admin';

/** The roles, least first. */
export const ROLES: readonly Role[] = ['viewer', 'editor', 'admin'];

/** A member as `GET /organisations/:id/members` lists them. */
export interface Member {
  userId: string;
  email: string;
  displayName: string;
  role: Role;
  joinedAt: string;
}

export async function listMembers(organisationId: string): Promise<Member[]> {
  const body = await apiFetch<{ members: Member[] }>(`/organisations/${organisationId}/members`);
  return body.members;
}

export function membersQueryOptions(organisationId: string) {
  return queryOptions({ queryKey: memberKeys.list(organisationId), queryFn: () => listMembers(organisationId) });
}

export function useMembers(organisationId: string) {
  return useQuery(membersQueryOptions(organisationId));
}
