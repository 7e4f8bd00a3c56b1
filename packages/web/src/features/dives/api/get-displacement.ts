import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api-client';
import type { DiveArchiveRef } from '../types';
import { diveKeys } from './keys';

/** How far a run moved the positions from another (`GET …/results/:resultId/displacement`), metres. */
export interface Displacement {
  resultId: string;
  againstResultId: string;
  fixCount: number;
  comparedCount: number;
  medianM: number | null;
  p95M: number | null;
  maxM: number | null;
  meanM: number | null;
  rmsM: number | null;
}

/** The displacement of a result's positions from another result's (by default the one before it). */
export async function getDisplacement(
  ref: DiveArchiveRef,
  diveId: string,
  resultId: string,
  againstId?: string,
): Promise<Displacement> {
  const query = againstId === undefined ? '' : `?against=${encodeURIComponent(againstId)}`;
  return apiFetch<Displacement>(
    `/organisations/${encodeURIComponent(ref.organisationId)}/projects/${encodeURIComponent(ref.projectId)}/dives/${encodeURIComponent(diveId)}/results/${encodeURIComponent(resultId)}/displacement${query}`,
  );
}

export function displacementQueryOptions(ref: DiveArchiveRef, diveId: string, resultId: string, againstId?: string) {
  return queryOptions({
    queryKey: diveKeys.displacement(diveId, resultId, againstId),
    queryFn: () => getDisplacement(ref, diveId, resultId, againstId),
    staleTime: Number.POSITIVE_INFINITY,
  });
}

export function useDisplacement(ref: DiveArchiveRef, diveId: string, resultId: string | undefined) {
  return useQuery({ ...displacementQueryOptions(ref, diveId, resultId ?? ''), enabled: resultId !== undefined });
}
