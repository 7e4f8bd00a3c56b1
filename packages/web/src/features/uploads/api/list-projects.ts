import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api-client';
import { uploadKeys } from './keys';

/** A project as the upload page offers it (a slice of the server's `ProjectSchema`). */
export interface UploadProject {
  id: string;
  name: string;
  site: string | null;
  auditProfile: string;
}

/** The organisation's projects by name (`GET /organisations/:organisationId/projects`). */
export async function listProjects(organisationId: string): Promise<UploadProject[]> {
  const body = await apiFetch<{ projects: UploadProject[] }>(
    `/organisations/${encodeURIComponent(organisationId)}/projects`,
  );
  return body.projects;
}

export function projectsQueryOptions(organisationId: string) {
  return queryOptions({
    queryKey: uploadKeys.projects(organisationId),
    queryFn: () => listProjects(organisationId),
  });
}

export function useProjects(organisationId: string | undefined) {
  return useQuery({ ...projectsQueryOptions(organisationId ?? ''), enabled: organisationId !== undefined });
}
