import { parseResolveSetup } from '@leadline/core';
import type { DiveStore, NewDive, NewDiveResult } from '../stores/dive-store.js';
import type { LogStore } from '../stores/log-store.js';
import type { ProcessingRunStore, RunRecord } from '../stores/processing-run-store.js';
import type { ProjectStore } from '../stores/project-store.js';
import type { FailedAudit } from './audit-notice-service.js';
import {
  type ComputeOutcome,
  computeProcess,
  computeReprocess,
  PermanentProcessingError,
  type ProcessInput,
  type ReprocessedDive,
  type ReprocessInput,
} from './processing-compute.js';

export { computeDiveResult, PermanentProcessingError } from './processing-compute.js';

/** Where the CPU-heavy part of a run is done: in this thread, or on worker threads (jobs/processing-threads.ts). */
export interface ProcessingCompute {
  process(input: ProcessInput): Promise<ComputeOutcome<NewDive[]>>;
  reprocess(input: ReprocessInput): Promise<ComputeOutcome<ReprocessedDive[]>>;
  close(): Promise<void>;
}

/** Does the work in the calling thread (tests, tools; the event loop is busy meanwhile). */
export const IN_THREAD_COMPUTE: ProcessingCompute = {
  process: async (input) => computeProcess(input),
  reprocess: async (input) => computeReprocess(input),
  close: async () => {},
};

/** What processing reaches: the archive and the stores of runs and dives. */
export interface ProcessingDeps {
  projects: ProjectStore;
  logs: LogStore;
  runs: ProcessingRunStore;
  dives: DiveStore;
  /** Where read, split, audit and summarise run; in this thread when absent. */
  compute?: ProcessingCompute | undefined;
}

/** Test hooks: called between the work and the store (to stop a worker mid-job). */
export interface ProcessingHooks {
  beforeStore?: (run: RunRecord) => Promise<void>;
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

function settled<T>(outcome: ComputeOutcome<T>): T {
  if (!outcome.ok) throw new PermanentProcessingError(outcome.permanent);
  return outcome.value;
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
  const compute = deps.compute ?? IN_THREAD_COMPUTE;
  const settings = { auditProfile: run.auditProfile, auditSetup: run.auditSetup, resolveSetup: run.resolveSetup };

  if (run.kind === 'process') {
    const content = await deps.logs.content(run.projectId, run.logId);
    if (content === undefined) throw new PermanentProcessingError('the log was deleted before it was processed');
    const dives = settled(
      await compute.process({
        ...settings,
        fileName: log.originalFileName,
        content,
        timeZone: project.timeZone,
        inputCrs: project.defaultCrs,
      }),
    );
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
  const inputs: ReprocessInput['dives'] = [];
  for (const diveId of diveIds) {
    const tracks = await deps.dives.tracks(diveId);
    if (tracks === undefined) throw new PermanentProcessingError(`dive ${diveId} has no stored fixes`);
    inputs.push({ diveId, vehicle: tracks.vehicle, surface: tracks.surface });
  }
  const computed = settled(await compute.reprocess({ ...settings, fileName: log.originalFileName, dives: inputs }));
  const results: Array<{ diveId: string; diveNumber: number; result: NewDiveResult }> = [];
  for (const [k, { diveId, result }] of computed.entries()) {
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
