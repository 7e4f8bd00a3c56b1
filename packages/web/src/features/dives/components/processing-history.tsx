import { useId } from 'react';
import type { DiveResultView } from '../api/get-dive-history';
import type { DiveRunView } from '../api/get-log-runs';
import { reportDownloadUrl } from '../lib/download-links';
import { formatDateTimeUtc, formatQuantity } from '../lib/format';
import type { DiveArchiveRef } from '../types';
import { SeverityBadge } from './severity-badge';

/** Props of the processing history. */
export interface ProcessingHistoryProps {
  diveId: string;
  archive: DiveArchiveRef;
  /** The log's runs, newest first (runs of other dives of the log are left out here). */
  runs: readonly DiveRunView[];
  /** The dive's results, newest first. */
  results: readonly DiveResultView[];
}

/** The parts of a re-solve setup worth a glance, in words. */
export function describeSetup(setup: Record<string, unknown> | null): string {
  if (setup === null) return 'Logged positions';
  const parts: string[] = [];
  const sound = setup.soundSpeed as
    | {
        loggedMps?: number;
        water?: { method: string; soundSpeedMps?: number; temperatureC?: number; salinityPsu?: number };
      }
    | undefined;
  if (sound?.water?.method === 'value') parts.push(`sound speed ${sound.water.soundSpeedMps} m/s`);
  else if (sound?.water && sound.water.temperatureC !== undefined)
    parts.push(
      `sound speed from ${sound.water.temperatureC} °C${sound.water.salinityPsu === undefined ? '' : `, ${sound.water.salinityPsu} PSU`}`,
    );
  const heading = setup.headingOffset as { valueDeg?: number } | undefined;
  if (heading?.valueDeg) parts.push(`heading offset ${heading.valueDeg}°`);
  const declination = setup.declination as { method?: string; valueDeg?: number } | undefined;
  if (declination?.method === 'wmm') parts.push('declination from the World Magnetic Model');
  else if (declination?.valueDeg) parts.push(`declination ${declination.valueDeg}°`);
  const arm = setup.leverArm as { forwardM?: number; starboardM?: number; downM?: number } | undefined;
  if (arm && (arm.forwardM || arm.starboardM || arm.downM))
    parts.push(`lever arm ${arm.forwardM ?? 0} / ${arm.starboardM ?? 0} / ${arm.downM ?? 0} m`);
  const draft = setup.transceiverDraft as { valueM?: number } | undefined;
  if (draft?.valueM) parts.push(`draft ${draft.valueM} m`);
  const surface = setup.surfacePosition as { method?: string; latDeg?: number; lonDeg?: number } | undefined;
  if (surface?.method === 'fixed') parts.push(`fixed surface position ${surface.latDeg}, ${surface.lonDeg}`);
  const name = typeof setup.name === 'string' ? setup.name : 're-solve setup';
  return `Re-solved (${name})${parts.length > 0 ? `: ${parts.join('; ')}` : ''}`;
}

const KIND: Record<string, string> = {
  process: 'Read and audited',
  'reprocess-dive': 'Reprocessed (this dive)',
  'reprocess-log': 'Reprocessed (whole log)',
};

/** Every run that touched the dive with its parameters and outcome; the latest result is the default shown. */
export function ProcessingHistory({ diveId, archive, runs, results }: ProcessingHistoryProps) {
  const id = useId();
  const resultOf = new Map(results.map((r) => [r.runId, r]));
  const latestId = results[0]?.id;
  const mine = runs.filter((run) => run.diveId === null || run.diveId === diveId);
  return (
    <section aria-labelledby={`${id}-heading`} className="flex flex-col gap-2">
      <h2 id={`${id}-heading`} className="text-lg font-semibold">
        Processing history <span className="font-normal text-abyss-soft">({mine.length})</span>
      </h2>
      {mine.length === 0 ? (
        <p className="text-sm text-abyss-soft">No run is recorded for this dive.</p>
      ) : (
        <div className="overflow-x-auto">
          <table className="w-full border-collapse text-left text-sm">
            <thead>
              <tr className="border-b border-abyss/20">
                <th scope="col" className="py-2 pr-3 font-semibold">
                  Run
                </th>
                <th scope="col" className="py-2 pr-3 font-semibold">
                  Profile and setup
                </th>
                <th scope="col" className="py-2 pr-3 font-semibold">
                  Outcome
                </th>
                <th scope="col" className="py-2 font-semibold">
                  Report
                </th>
              </tr>
            </thead>
            <tbody>
              {mine.map((run) => {
                const result = resultOf.get(run.id);
                const isDefault = result !== undefined && result.id === latestId;
                const kind =
                  run.kind === 'process' ? 'process' : run.diveId === null ? 'reprocess-log' : 'reprocess-dive';
                const moved = result?.resolveComparison?.movedM;
                return (
                  <tr key={run.id} className="border-b border-abyss/10 align-top" data-run-status={run.status}>
                    <td className="py-2 pr-3">
                      <span className="block font-medium">{KIND[kind]}</span>
                      <span className="text-abyss-soft">{formatDateTimeUtc(Date.parse(run.createdAt))}</span>
                      {isDefault ? (
                        <span className="mt-1 block w-fit rounded bg-abyss px-1.5 py-0.5 text-xs font-semibold text-foam">
                          Default — shown above
                        </span>
                      ) : null}
                    </td>
                    <td className="py-2 pr-3">
                      <span className="block">{run.auditProfile}</span>
                      <span className="text-abyss-soft">{describeSetup(result?.resolveSetup ?? run.resolveSetup)}</span>
                      {moved && moved.medianM !== null ? (
                        <span className="block text-abyss-soft">
                          Moved from the logged positions: median {formatQuantity(moved.medianM, 'm', 2)}, max{' '}
                          {formatQuantity(moved.maxM, 'm', 2)}
                        </span>
                      ) : null}
                    </td>
                    <td className="py-2 pr-3">
                      {result ? (
                        <span className="flex flex-wrap items-center gap-2">
                          <SeverityBadge level={result.verdict} />
                          <span className="text-abyss-soft">
                            {result.flaggedCount.toLocaleString('en-GB')} fixes flagged
                          </span>
                        </span>
                      ) : run.status === 'failed' ? (
                        <span className="text-[#9c211a]">Failed: {run.reason ?? 'no reason given'}</span>
                      ) : run.status === 'done' ? (
                        <span className="text-abyss-soft">Done (no result for this dive)</span>
                      ) : (
                        <span className="text-abyss-soft">{run.status === 'queued' ? 'Queued' : 'Processing…'}</span>
                      )}
                    </td>
                    <td className="py-2">
                      {result ? (
                        <span className="flex gap-2">
                          {(['json', 'md', 'html'] as const).map((format) => (
                            <a
                              key={format}
                              href={reportDownloadUrl(archive, diveId, format, result.id)}
                              download
                              className="text-kelp underline underline-offset-2 hover:text-abyss focus-visible:outline-3 focus-visible:outline-kelp"
                              aria-label={`${format.toUpperCase()} report of the run of ${formatDateTimeUtc(Date.parse(run.createdAt))}`}
                            >
                              {format === 'md' ? 'MD' : format.toUpperCase()}
                            </a>
                          ))}
                        </span>
                      ) : (
                        '—'
                      )}
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      )}
    </section>
  );
}
