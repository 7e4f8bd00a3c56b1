import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api-client';
import { uploadKeys } from './keys';

/** A dive split out of an uploaded log (a slice of the server's `DiveSchema`). */
export interface LogDive {
  id: string;
  diveNumber: number;
  verdict: 'pass' | 'warn' | 'fail' | null;
  fixCount: number;
  startTime: string | null;
}

/** The dives of one log, first to last (`GET …/dives?logId=`). */
export async function listLogDives(organisationId: string, projectId: string, logId: string): Promise<LogDive[]> {
  const query = new URLSearchParams({ logId, sort: 'startTime', limit: '500' });
  const body = await apiFetch<{ dives: LogDive[] }>(
    `/organisations/${encodeURIComponent(organisationId)}/projects/${encodeURIComponent(projectId)}/dives?${query}`,
  );
  return [...body.dives].sort((a, b) => a.diveNumber - b.diveNumber);
}

export function logDivesQueryOptions(organisationId: string, projectId: string, logId: string) {
  return queryOptions({
    queryKey: uploadKeys.dives(organisationId, projectId, logId),
    queryFn: () => listLogDives(organisationId, projectId, logId),
  });
}

export function useLogDives(organisationId: string, projectId: string, logId: string, enabled: boolean) {
  return useQuery({ ...logDivesQueryOptions(organisationId, projectId, logId), enabled });
}
