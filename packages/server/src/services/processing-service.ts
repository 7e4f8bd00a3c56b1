import {
  type AuditProfile,
  type AuditSetup,
  auditTrack,
  buildDiveReport,
  formatRejection,
  InvalidArgumentError,
  LeadlineError,
  parseAuditSetup,
  parseResolveSetup,
  readLog,
  resolveAuditProfile,
  resolveTrack,
  splitDives,
  type Track,
  takeFixes,
} from '@leadline/core';
import type { DiveStore, NewDive, NewDiveResult } from '../stores/dive-store.js';
import type { LogStore } from '../stores/log-store.js';
import type { ProcessingRunStore, RunRecord } from '../stores/processing-run-store.js';
import type { ProjectStore } from '../stores/project-store.js';
import type { FailedAudit } from './audit-notice-service.js';

/** What processing reaches: the archive and the stores of runs and dives. */
export interface ProcessingDeps {
  projects: ProjectStore;
  logs: LogStore;
  runs: ProcessingRunStore;
  dives: DiveStore;
}

/** Test hooks: called between the work and the store (to stop a worker mid-job). */
export interface ProcessingHooks {
  beforeStore?: (run: RunRecord) => Promise<void>;
}

/** A failure that another attempt cannot fix (an unreadable log, an unknown profile): the run fails at once. */
export class PermanentProcessingError extends Error {
  override readonly name = 'PermanentProcessingError';
}

/** How a run ended when the worker is done with it; `failedAudits` are the dives whose verdict is fail. */
export type RunOutcome = { status: 'done'; diveCount: number; failedAudits: FailedAudit[] } | { status: 'skipped' };

function failedAudits(
  organisationId: string,
  projectId: string,
  logFileName: string,
  dives: Array<{ diveId: string; diveNumber: number; result: NewDiveResult }>,
): FailedAudit[] {
  return dives
    .filter((d) => d.result.verdict === 'fail')
    .map((d) => ({
      organisationId,
      projectId,
      logFileName,
      diveLabel: `dive ${d.diveNumber}${d.result.summary.startTime === null ? '' : `, ${d.result.summary.startTime.slice(0, 16).replace('T', ' ')} UTC`}`,
      divePath: `/dives/${d.diveId}`,
      findings: d.result.findings
        .filter((f) => f.severity !== 'info')
        .sort((a, b) => (a.severity === b.severity ? 0 : a.severity === 'fail' ? -1 : 1))
        .map((f) => ({ check: f.check, severity: f.severity, message: f.message })),
    }));
}

/** The audit setup a project's default re-solve setup implies: its transceiver draft. */
export function auditSetupFromResolveSetup(setup: unknown): Record<string, unknown> {
  if (setup === null || setup === undefined) return {};
  try {
    const parsed = parseResolveSetup(setup);
    return { transceiverDraftM: parsed.transceiverDraft.valueM };
  } catch {
    return {};
  }
}

function permanent<T>(what: string, work: () => T): T {
  try {
    return work();
  } catch (error) {
    if (error instanceof LeadlineError || error instanceof InvalidArgumentError)
      throw new PermanentProcessingError(`${what}: ${error.message}`);
    throw error;
  }
}

/** Audits (after re-solving, when the run has a re-solve setup) one dive's track and builds its result. */
export function computeDiveResult(input: {
  fileName: string;
  vehicle: Track;
  surface: Track | undefined;
  profile: AuditProfile;
  auditSetup: AuditSetup;
  resolveSetup: unknown;
}): { result: NewDiveResult; audited: Track } {
  let audited = input.vehicle;
  let resolveComparison: unknown = null;
  let resolveSetup: unknown = null;
  if (input.resolveSetup !== null && input.resolveSetup !== undefined) {
    const resolved = permanent(`re-solving ${input.vehicle.id}`, () =>
      resolveTrack(input.vehicle, input.resolveSetup, {
        ...(input.surface === undefined ? {} : { surfaceTrack: input.surface }),
        auditProfile: input.profile,
        auditSetup: input.auditSetup,
      }),
    );
    audited = resolved.track;
    resolveSetup = resolved.setup;
    resolveComparison = {
      fixCount: resolved.comparison.fixCount,
      resolvedCount: resolved.comparison.resolvedCount,
      rejectedCount: resolved.comparison.rejectedCount,
      movedM: resolved.comparison.summary,
      audit: resolved.comparison.audit,
      applied: resolved.applied,
      rejections: resolved.rejections
        .slice(0, 100)
        .map((r) => ({ line: r.line, reason: r.reason, message: r.message })),
    };
  }
  const audit = auditTrack(audited, { profile: input.profile, setup: input.auditSetup });
  const report = buildDiveReport(
    input.surface === undefined
      ? { file: input.fileName, track: audited, audit }
      : { file: input.fileName, track: audited, audit, surface: input.surface },
  );
  return {
    audited,
    result: {
      verdict: audit.verdict,
      auditProfile: audit.profile,
      resolveSetup,
      auditSetup: input.auditSetup as Record<string, unknown>,
      summary: report.summary,
      report,
      resolveComparison,
      flags: audit.flags,
      flaggedCount: audit.flaggedCount,
      findings: audit.findings,
    },
  };
}

/** The surface unit's fixes within a dive's time span. */
function surfaceDuring(surface: Track | undefined, vehicle: Track): Track | undefined {
  if (surface === undefined || vehicle.length === 0) return undefined;
  const from = vehicle.columns.timeMs[0] as number;
  const to = vehicle.columns.timeMs[vehicle.length - 1] as number;
  const keep = new Uint8Array(surface.length);
  for (let i = 0; i < surface.length; i++) {
    const t = surface.columns.timeMs[i] as number;
    keep[i] = t >= from && t <= to ? 1 : 0;
  }
  return takeFixes(surface, keep, { id: `${vehicle.id}#surface` });
}

/**
 * Does one processing run: a `process` run reads the log, splits each vehicle track into dives
 * (the profile's split settings), audits and summarises each; a `reprocess` run audits the stored
 * dives again (re-solving first when the run has a re-solve setup). Everything is stored in one
 * transaction at the end, so a worker stopped half-way leaves nothing half-written and the stored
 * log is never touched. Throws `PermanentProcessingError` for what retrying cannot fix.
 */
export async function performRun(
  deps: ProcessingDeps,
  runId: string,
  organisationId: string,
  hooks: ProcessingHooks = {},
): Promise<RunOutcome> {
  const run = await deps.runs.start(runId);
  if (run === undefined) return { status: 'skipped' };
  const project = await deps.projects.find(organisationId, run.projectId);
  const log = await deps.logs.find(run.projectId, run.logId);
  if (project === undefined || log === undefined)
    throw new PermanentProcessingError('the log or its project was deleted before it was processed');
  const profile = permanent('audit profile', () => resolveAuditProfile(run.auditProfile));
  const auditSetup = permanent('audit setup', () => parseAuditSetup(run.auditSetup));

  if (run.kind === 'process') {
    const content = await deps.logs.content(run.projectId, run.logId);
    if (content === undefined) throw new PermanentProcessingError('the log was deleted before it was processed');
    const read = permanent('reading the log', () =>
      // Local times are read in the project's zone, projected coordinates in the project's CRS.
      readLog(
        { fileName: log.originalFileName, content },
        {
          timeZone: project.timeZone,
          ...(project.defaultCrs === null ? {} : { inputCrs: project.defaultCrs }),
        },
      ),
    );
    const vehicles = read.tracks.filter((t) => t.role === 'vehicle');
    const surface = read.tracks.find((t) => t.role === 'surface');
    if (vehicles.length === 0 && surface === undefined) {
      const why = read.rejections[0] === undefined ? 'the log holds no track' : formatRejection(read.rejections[0]);
      throw new PermanentProcessingError(`nothing to process: ${why}`);
    }
    const dives: NewDive[] = [];
    for (const vehicle of vehicles) {
      const parts = splitDives(vehicle, profile).dives.map((d) => d.track);
      for (const track of parts.length > 0 ? parts : [vehicle]) {
        const diveSurface = surfaceDuring(surface, track);
        const { result } = computeDiveResult({
          fileName: log.originalFileName,
          vehicle: track,
          surface: diveSurface,
          profile,
          auditSetup,
          resolveSetup: run.resolveSetup,
        });
        dives.push({ diveNumber: dives.length + 1, vehicle: track, surface: diveSurface, result });
      }
    }
    await hooks.beforeStore?.(run);
    const ids = await deps.dives.storeProcessed(run.id, run.logId, run.projectId, dives);
    if (ids === undefined) return { status: 'skipped' };
    const stored = dives.map((d, k) => ({ diveId: ids[k] ?? '', diveNumber: d.diveNumber, result: d.result }));
    return {
      status: 'done',
      diveCount: ids.length,
      failedAudits: failedAudits(organisationId, run.projectId, log.originalFileName, stored),
    };
  }

  const diveIds = run.diveId === null ? await deps.dives.diveIdsOfLog(run.logId) : [run.diveId];
  const results: Array<{ diveId: string; diveNumber: number; result: NewDiveResult }> = [];
  for (const [k, diveId] of diveIds.entries()) {
    const tracks = await deps.dives.tracks(diveId);
    if (tracks === undefined) throw new PermanentProcessingError(`dive ${diveId} has no stored fixes`);
    const { result } = computeDiveResult({
      fileName: log.originalFileName,
      vehicle: tracks.vehicle,
      surface: tracks.surface,
      profile,
      auditSetup,
      resolveSetup: run.resolveSetup,
    });
    const diveNumber = run.diveId === null ? k + 1 : ((await deps.dives.find(run.projectId, diveId))?.diveNumber ?? 0);
    results.push({ diveId, diveNumber, result });
  }
  await hooks.beforeStore?.(run);
  const stored = await deps.dives.storeReprocessed(run.id, results);
  if (!stored) return { status: 'skipped' };
  return {
    status: 'done',
    diveCount: results.length,
    failedAudits: failedAudits(organisationId, run.projectId, log.originalFileName, results),
  };
}
