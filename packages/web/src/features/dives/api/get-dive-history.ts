import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api-client';
import type { DiveArchiveRef, Verdict } from '../types';
import { diveKeys } from './keys';

/** How far a re-solve moved the logged positions, as the run stored it (core's comparison). */
export interface ResolveComparisonView {
  resolvedCount: number;
  rejectedCount: number;
  movedM: { comparedCount: number; medianM: number | null; p95M: number | null; maxM: number | null };
}

/** What one run made of the dive (the server's `ResultSchema`). */
export interface DiveResultView {
  id: string;
  runId: string;
  verdict: Verdict;
  auditProfile: string;
  /** The re-solve setup the run used; `null` when positions were audited as logged. */
  resolveSetup: Record<string, unknown> | null;
  auditSetup: Record<string, unknown>;
  flaggedCount: number;
  findingCounts: Record<string, number>;
  resolveComparison: ResolveComparisonView | null;
  createdAt: string;
}

/** One dive's results, newest first (`GET …/projects/:projectId/dives/:diveId`). */
export async function getDiveHistory(ref: DiveArchiveRef, diveId: string): Promise<DiveResultView[]> {
  const body = await apiFetch<{ results: DiveResultView[] }>(
    `/organisations/${encodeURIComponent(ref.organisationId)}/projects/${encodeURIComponent(ref.projectId)}/dives/${encodeURIComponent(diveId)}`,
  );
  return body.results;
}

export function diveHistoryQueryOptions(ref: DiveArchiveRef, diveId: string) {
  return queryOptions({ queryKey: diveKeys.history(diveId), queryFn: () => getDiveHistory(ref, diveId) });
}

export function useDiveHistory(ref: DiveArchiveRef, diveId: string) {
  return useQuery(diveHistoryQueryOptions(ref, diveId));
}
