import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api-client';
import { uploadKeys } from './keys';

/** Where a log's processing stands. */
export type RunStatus = 'queued' | 'processing' | 'done' | 'failed';

/** One processing run of a log (a slice of the server's `RunSchema`). */
export interface LogRun {
  id: string;
  kind: 'process' | 'reprocess';
  status: RunStatus;
  reason: string | null;
  auditProfile: string;
  createdAt: string;
  finishedAt: string | null;
}

/** How often a log still being processed is asked about again, ms. */
export const RUN_POLL_MS = 1000;

/** A log's runs, newest first (`GET …/logs/:logId/runs`). */
export async function getLogRuns(organisationId: string, projectId: string, logId: string): Promise<LogRun[]> {
  const body = await apiFetch<{ runs: LogRun[] }>(
    `/organisations/${encodeURIComponent(organisationId)}/projects/${encodeURIComponent(projectId)}/logs/${encodeURIComponent(logId)}/runs`,
  );
  return body.runs;
}

/** Whether a run has ended, one way or the other. */
export function isRunFinished(run: LogRun | undefined): boolean {
  return run !== undefined && (run.status === 'done' || run.status === 'failed');
}

export function logRunsQueryOptions(organisationId: string, projectId: string, logId: string) {
  return queryOptions({
    queryKey: uploadKeys.runs(organisationId, projectId, logId),
    queryFn: () => getLogRuns(organisationId, projectId, logId),
    // Asked again every second until the latest run is done or failed.
    refetchInterval: (query) => (isRunFinished(query.state.data?.[0]) ? false : RUN_POLL_MS),
    staleTime: 0,
  });
}

export function useLogRuns(organisationId: string, projectId: string, logId: string) {
  return useQuery(logRunsQueryOptions(organisationId, projectId, logId));
}
