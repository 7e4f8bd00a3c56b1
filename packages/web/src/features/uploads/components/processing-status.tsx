import { Link } from 'react-router-dom';
import { buttonStyles } from '../../../components/ui/button-styles';
import { ApiError } from '../../../lib/api-client';
import { isRunFinished, type LogRun, useLogRuns } from '../api/get-log-runs';
import { type LogDive, useLogDives } from '../api/list-log-dives';
import { VerdictChip } from './verdict-chip';

const STATUS_TEXT: Record<LogRun['status'], string> = {
  queued: 'Queued for processing',
  processing: 'Processing',
  done: 'Processed',
  failed: 'Processing failed',
};

/** Props of the processing status of one archived log. */
export interface ProcessingStatusViewProps {
  /** The log's latest run; undefined while it is first asked for. */
  run: LogRun | undefined;
  /** The log's dives once the run is done. */
  dives: readonly LogDive[] | undefined;
  /** A failure asking the server, with a way to ask again. */
  error?: unknown;
  onRetry?: () => void;
}

function describeError(error: unknown): string {
  if (error instanceof ApiError)
    return `${error.message} (${error.status === 0 ? 'no answer' : `HTTP ${error.status}`})`;
  return error instanceof Error ? error.message : String(error);
}

/** Where an archived log's processing stands: status, reason when it failed, its dives with their verdicts. */
export function ProcessingStatusView({ run, dives, error, onRetry }: ProcessingStatusViewProps) {
  if (error !== undefined && error !== null)
    return (
      <div role="alert" className="flex flex-wrap items-center gap-2 text-sm text-[#7d1a14]">
        The processing status could not be read: {describeError(error)}
        {onRetry ? (
          <button type="button" className={buttonStyles('secondary')} onClick={onRetry}>
            Try again
          </button>
        ) : null}
      </div>
    );
  if (run === undefined) return <p className="text-sm text-abyss-soft">Asking for the processing status…</p>;
  const finished = isRunFinished(run);
  return (
    <div className="flex flex-col gap-1 text-sm">
      <p className="flex items-center gap-2" data-run-status={run.status}>
        {finished ? null : (
          <span
            aria-hidden="true"
            className="inline-block size-3 animate-spin rounded-full border-2 border-kelp border-t-transparent motion-reduce:animate-none"
          />
        )}
        <span className={run.status === 'failed' ? 'font-semibold text-[#9c211a]' : 'font-medium'}>
          {STATUS_TEXT[run.status]}
        </span>
        <span className="text-abyss-soft">with the {run.auditProfile} profile</span>
      </p>
      {run.status === 'failed' ? <p className="text-[#7d1a14]">{run.reason ?? 'No reason was given.'}</p> : null}
      {run.status === 'done' && dives === undefined ? <p className="text-abyss-soft">Listing its dives…</p> : null}
      {run.status === 'done' && dives !== undefined && dives.length === 0 ? (
        <p className="text-abyss-soft">No dive was found in this log.</p>
      ) : null}
      {run.status === 'done' && dives !== undefined && dives.length > 0 ? (
        <ul className="flex flex-wrap gap-2" aria-label="Dives of this log">
          {dives.map((dive) => (
            <li key={dive.id} className="flex items-center gap-1">
              <Link
                to={`/dives/${dive.id}`}
                className="font-medium text-kelp underline underline-offset-2 hover:text-abyss focus-visible:outline-3 focus-visible:outline-offset-2 focus-visible:outline-kelp"
              >
                Dive {dive.diveNumber}
              </Link>
              {dive.verdict ? <VerdictChip verdict={dive.verdict} /> : null}
            </li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}

/** Follows an archived log's processing until it is done or failed, then lists its dives. */
export function ProcessingStatus({
  organisationId,
  projectId,
  logId,
}: {
  organisationId: string;
  projectId: string;
  logId: string;
}) {
  const runs = useLogRuns(organisationId, projectId, logId);
  const run = runs.data?.[0];
  const dives = useLogDives(organisationId, projectId, logId, run?.status === 'done');
  const error = runs.error ?? dives.error ?? undefined;
  return (
    <ProcessingStatusView
      run={run}
      dives={dives.data}
      error={error}
      onRetry={() => {
        if (runs.isError) void runs.refetch();
        if (dives.isError) void dives.refetch();
      }}
    />
  );
}
