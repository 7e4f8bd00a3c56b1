import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api-client';
import type { DiveArchiveRef } from '../types';
import { diveKeys } from './keys';

/** The project settings the dive page needs (a slice of the server's `ProjectSchema`). */
export interface ProjectSettings {
  id: string;
  name: string;
  defaultCrs: string | null;
  auditProfile: string;
  /** The project's default re-solve setup, `null` when it has none. */
  defaultSetup: Record<string, unknown> | null;
}

/** One project's settings (`GET /organisations/:organisationId/projects/:projectId`). */
export async function getProjectSettings(ref: DiveArchiveRef): Promise<ProjectSettings> {
  const body = await apiFetch<{ project: ProjectSettings }>(
    `/organisations/${encodeURIComponent(ref.organisationId)}/projects/${encodeURIComponent(ref.projectId)}`,
  );
  return body.project;
}

export function projectSettingsQueryOptions(ref: DiveArchiveRef) {
  return queryOptions({
    queryKey: diveKeys.project(ref.organisationId, ref.projectId),
    queryFn: () => getProjectSettings(ref),
  });
}

export function useProjectSettings(ref: DiveArchiveRef) {
  return useQuery(projectSettingsQueryOptions(ref));
}
