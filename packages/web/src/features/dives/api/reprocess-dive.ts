import { useMutation } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api-client';
import type { DiveArchiveRef } from '../types';
import type { DiveRunView } from './get-log-runs';

/** What a reprocess asks for (the server's `ReprocessBody`); omitted fields take the project's settings. */
export interface ReprocessRequest {
  auditProfile?: string;
  /** A re-solve setup (core's `resolveSetupSchema`); `null` audits the positions as logged. */
  setup?: Record<string, unknown> | null;
}

/** Queues a reprocess of one dive (`POST …/dives/:diveId/reprocess`); answers with the queued run. */
export async function reprocessDive(
  ref: DiveArchiveRef,
  diveId: string,
  request: ReprocessRequest,
): Promise<DiveRunView> {
  const body = await apiFetch<{ run: DiveRunView }>(
    `/organisations/${encodeURIComponent(ref.organisationId)}/projects/${encodeURIComponent(ref.projectId)}/dives/${encodeURIComponent(diveId)}/reprocess`,
    { method: 'POST', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify(request) },
  );
  return body.run;
}

export function useReprocessDive(ref: DiveArchiveRef, diveId: string) {
  return useMutation({ mutationFn: (request: ReprocessRequest) => reprocessDive(ref, diveId, request) });
}
