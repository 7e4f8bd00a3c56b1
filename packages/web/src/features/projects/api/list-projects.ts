import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api-client';
import type { Project } from '../types';
import { projectKeys } from './keys';

/** The organisation's projects. */
export async function listProjects(organisationId: string): Promise<Project[]> {
  return (await apiFetch<{ projects: Project[] }>(`/organisations/${encodeURIComponent(organisationId)}/projects`))
    .projects;
}

export function projectsQueryOptions(organisationId: string) {
  return queryOptions({ queryKey: projectKeys.list(organisationId), queryFn: () => listProjects(organisationId) });
}

/** The organisation's projects; asks nothing until an organisation is known. */
export function useProjects(organisationId: string | undefined) {
  return useQuery({ ...projectsQueryOptions(organisationId ?? ''), enabled: organisationId !== undefined });
}
