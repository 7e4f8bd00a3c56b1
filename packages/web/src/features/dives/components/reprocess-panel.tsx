import { useQueryClient } from '@tanstack/react-query';
import { useEffect, useId, useState } from 'react';
import { buttonStyles } from '../../../components/ui/button-styles';
import { describeFailure } from '../../../components/ui/describe-failure';
import { useDisplacement } from '../api/get-displacement';
import type { DiveResultView } from '../api/get-dive-history';
import type { DiveRunView } from '../api/get-log-runs';
import { diveKeys } from '../api/keys';
import { useReprocessDive } from '../api/reprocess-dive';
import { formatCount, formatQuantity } from '../lib/format';
import type { DiveArchiveRef } from '../types';
import { ReprocessForm } from './reprocess-form';

/** Props of the reprocess panel. */
export interface ReprocessPanelProps {
  diveId: string;
  archive: DiveArchiveRef;
  /** The profile the latest run used. */
  currentProfile: string;
  /** The log's runs, newest first (polled while one is open). */
  runs: readonly DiveRunView[] | undefined;
  /** The dive's results, newest first. */
  results: readonly DiveResultView[] | undefined;
}

function Movement({ archive, diveId, resultId }: { archive: DiveArchiveRef; diveId: string; resultId: string }) {
  const moved = useDisplacement(archive, diveId, resultId);
  if (moved.isPending) return <p className="text-sm text-abyss-soft">Measuring how far the positions moved…</p>;
  if (moved.isError)
    return (
      <div role="alert" className="flex flex-wrap items-center gap-2 text-sm text-[#7d1a14]">
        How far the positions moved could not be measured: {describeFailure(moved.error)}
        <button type="button" className={buttonStyles('secondary')} onClick={() => moved.refetch()}>
          Try again
        </button>
      </div>
    );
  const m = moved.data;
  return (
    <div data-testid="displacement" className="rounded-md border border-kelp/40 bg-foam p-3 text-sm">
      <p className="font-semibold">How far the positions moved from the run before</p>
      <dl className="mt-1 grid grid-cols-[auto_1fr] gap-x-4 gap-y-0.5">
        <dt>Median</dt>
        <dd className="tabular-nums">{formatQuantity(m.medianM, 'm', 2)}</dd>
        <dt>95th percentile</dt>
        <dd className="tabular-nums">{formatQuantity(m.p95M, 'm', 2)}</dd>
        <dt>Largest</dt>
        <dd className="tabular-nums">{formatQuantity(m.maxM, 'm', 2)}</dd>
        <dt>Fixes compared</dt>
        <dd className="tabular-nums">
          {formatCount(m.comparedCount)} of {formatCount(m.fixCount)}
        </dd>
      </dl>
      <p className="mt-1 text-abyss-soft">
        Horizontal geodesic distances on WGS 84 between the two runs' positions of each fix.
      </p>
    </div>
  );
}

/** The reprocess form for editors and admins; follows the queued run and then says how far positions moved. */
export function ReprocessPanel({ diveId, archive, currentProfile, runs, results }: ReprocessPanelProps) {
  const id = useId();
  const queryClient = useQueryClient();
  const reprocess = useReprocessDive(archive, diveId);
  const [runId, setRunId] = useState<string | undefined>(undefined);
  const run = runId === undefined ? undefined : runs?.find((r) => r.id === runId);
  const finished = run?.status === 'done' || run?.status === 'failed';
  const result = run?.status === 'done' ? results?.find((r) => r.runId === run.id) : undefined;

  // When the run ends, the dive (plots, findings) and its history are read again.
  useEffect(() => {
    if (!finished) return;
    void queryClient.invalidateQueries({ queryKey: diveKeys.detail(diveId) });
    void queryClient.invalidateQueries({ queryKey: diveKeys.history(diveId) });
  }, [finished, diveId, queryClient]);

  const submit = async (request: Parameters<typeof reprocess.mutateAsync>[0]) => {
    try {
      const queued = await reprocess.mutateAsync(request);
      setRunId(queued.id);
      await queryClient.invalidateQueries({ queryKey: diveKeys.runs(archive.logId) });
    } catch {
      // The mutation's error shows under the form.
    }
  };

  return (
    <section
      aria-labelledby={`${id}-heading`}
      className="flex flex-col gap-3 rounded-lg border border-abyss/15 bg-white p-4"
    >
      <h2 id={`${id}-heading`} className="text-lg font-semibold">
        Reprocess
      </h2>
      <p className="text-sm text-abyss-soft">
        A new run is kept beside the earlier ones; the newest becomes the default shown on this page.
      </p>
      <ReprocessForm
        currentProfile={currentProfile}
        onSubmit={submit}
        busy={reprocess.isPending || (runId !== undefined && !finished)}
        error={reprocess.error}
      />
      <div aria-live="polite" className="flex flex-col gap-2">
        {runId !== undefined && !finished ? (
          <p className="text-sm" data-testid="reprocess-status">
            {run?.status === 'processing' ? 'Processing the dive again…' : 'Queued; waiting for a worker…'}
          </p>
        ) : null}
        {run?.status === 'failed' ? (
          <p role="alert" className="text-sm text-[#7d1a14]" data-testid="reprocess-status">
            The run failed: {run.reason ?? 'no reason given'}
          </p>
        ) : null}
        {run?.status === 'done' ? (
          <p className="text-sm font-medium" data-testid="reprocess-status">
            Done. The page now shows the new run.
          </p>
        ) : null}
        {result ? <Movement archive={archive} diveId={diveId} resultId={result.id} /> : null}
      </div>
    </section>
  );
}
