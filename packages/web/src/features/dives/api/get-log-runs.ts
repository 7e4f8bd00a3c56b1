import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api-client';
import type { DiveArchiveRef } from '../types';
import { diveKeys } from './keys';

/** One processing run of the dive's log (the server's `RunSchema`). */
export interface DiveRunView {
  id: string;
  /** The dive it reprocessed; `null` for a run over the whole log. */
  diveId: string | null;
  kind: 'process' | 'reprocess';
  status: 'queued' | 'processing' | 'done' | 'failed';
  reason: string | null;
  auditProfile: string;
  resolveSetup: Record<string, unknown> | null;
  auditSetup: Record<string, unknown>;
  createdAt: string;
  finishedAt: string | null;
}

/** The log's runs, newest first (`GET …/logs/:logId/runs`). */
export async function getLogRuns(ref: DiveArchiveRef): Promise<DiveRunView[]> {
  const body = await apiFetch<{ runs: DiveRunView[] }>(
    `/organisations/${encodeURIComponent(ref.organisationId)}/projects/${encodeURIComponent(ref.projectId)}/logs/${encodeURIComponent(ref.logId)}/runs`,
  );
  return body.runs;
}

/** Whether some run is still waiting or working. */
export function hasOpenRun(runs: readonly DiveRunView[] | undefined): boolean {
  return (runs ?? []).some((run) => run.status === 'queued' || run.status === 'processing');
}

export function logRunsQueryOptions(ref: DiveArchiveRef) {
  return queryOptions({
    queryKey: diveKeys.runs(ref.logId),
    queryFn: () => getLogRuns(ref),
    // Followed every second while a run is queued or processing.
    refetchInterval: (query) => (hasOpenRun(query.state.data) ? 1000 : false),
    staleTime: 0,
  });
}

export function useLogRuns(ref: DiveArchiveRef) {
  return useQuery(logRunsQueryOptions(ref));
}
