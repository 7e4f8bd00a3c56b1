import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api-client';
import type { Project } from '../types';
import { projectKeys } from './keys';

/** One project of the organisation. */
export async function getProject(organisationId: string, projectId: string): Promise<Project> {
  return (
    await apiFetch<{ project: Project }>(
      `/organisations/${encodeURIComponent(organisationId)}/projects/${encodeURIComponent(projectId)}`,
    )
  ).project;
}

export function projectQueryOptions(organisationId: string, projectId: string) {
  return queryOptions({
    queryKey: projectKeys.detail(organisationId, projectId),
    queryFn: () => getProject(organisationId, projectId),
  });
}

export function useProject(organisationId: string | undefined, projectId: string) {
  return useQuery({ ...projectQueryOptions(organisationId ?? '', projectId), enabled: organisationId !== undefined });
}
