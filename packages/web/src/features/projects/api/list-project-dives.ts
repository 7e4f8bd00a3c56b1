import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api-client';
import type { DivePage } from '../types';
import { projectKeys } from './keys';

/** One page of a project's dives; `params` are the server's filter, sort and page parameters. */
export async function listProjectDives(
  organisationId: string,
  projectId: string,
  params: URLSearchParams,
): Promise<DivePage> {
  return apiFetch<DivePage>(
    `/organisations/${encodeURIComponent(organisationId)}/projects/${encodeURIComponent(projectId)}/dives?${params}`,
  );
}

export function projectDivesQueryOptions(organisationId: string, projectId: string, params: URLSearchParams) {
  const query = params.toString();
  return queryOptions({
    queryKey: projectKeys.diveList(organisationId, projectId, query),
    queryFn: () => listProjectDives(organisationId, projectId, new URLSearchParams(query)),
  });
}

/** A page of dives; keeps showing the last page while the next loads (sorting, paging). */
export function useProjectDives(
  organisationId: string | undefined,
  projectId: string,
  params: URLSearchParams,
  enabled = true,
) {
  return useQuery({
    ...projectDivesQueryOptions(organisationId ?? '', projectId, params),
    enabled: enabled && organisationId !== undefined,
    placeholderData: keepPreviousData,
  });
}
