import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api-client';
import type { DiveListItem } from '../types';
import { projectKeys } from './keys';

/** A dive of any project of the organisation, with its project's id. */
export type OrganisationDive = DiveListItem & { projectId: string };

/** Dives of every project of the organisation: `params` as the server takes them (verdict, sort, limit…). */
export async function listOrganisationDives(
  organisationId: string,
  params: URLSearchParams,
): Promise<{ dives: OrganisationDive[]; total: number }> {
  return apiFetch(`/organisations/${encodeURIComponent(organisationId)}/dives?${params}`);
}

export function organisationDivesQueryOptions(organisationId: string, params: URLSearchParams) {
  const query = params.toString();
  return queryOptions({
    queryKey: projectKeys.organisationDives(organisationId, query),
    queryFn: () => listOrganisationDives(organisationId, new URLSearchParams(query)),
  });
}

export function useOrganisationDives(organisationId: string | undefined, params: URLSearchParams) {
  return useQuery({
    ...organisationDivesQueryOptions(organisationId ?? '', params),
    enabled: organisationId !== undefined,
  });
}
