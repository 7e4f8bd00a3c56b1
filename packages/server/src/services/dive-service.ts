import {
  auditTrack,
  buildReportPlot,
  formatDiveReportHtml,
  formatDiveReportMarkdown,
  formatReportJson,
  geodesicDistanceM,
  LeadlineError,
  type MovementSummary,
  parseAuditSetup,
  parseResolveSetup,
  resolveAuditProfile,
  resolveTrack,
  smoothTrack,
  summariseMovement,
  type Track,
} from '@leadline/core';
import { AppError } from '../http/errors.js';
import type { ProcessingQueue } from '../jobs/processing-queue.js';
import type { ActivityStore } from '../stores/activity-store.js';
import type {
  DiveQuery,
  DiveRecord,
  DiveResultRecord,
  DiveStore,
  OrganisationDiveQuery,
} from '../stores/dive-store.js';
import type { LogRecord, LogStore } from '../stores/log-store.js';
import type { ProcessingRunStore, RunRecord } from '../stores/processing-run-store.js';
import type { ProjectRecord, ProjectStore } from '../stores/project-store.js';
import type { MembershipCheck } from './dive-view-service.js';
import { type PreparedFile, prepareFile } from './prepared-file.js';
import { auditSetupFromResolveSetup } from './processing-service.js';
import type { RenderCache } from './render-cache.js';
import { baseName, renderTracks, type TrackFormat } from './track-output.js';

/** What the dive services reach. */
export interface DiveDeps {
  projects: ProjectStore;
  logs: LogStore;
  runs: ProcessingRunStore;
  dives: DiveStore;
  activity: ActivityStore;
  /** Absent when the app runs without a job queue: runs then wait as `queued` for a worker. */
  queue?: ProcessingQueue | undefined;
  now: () => Date;
  /** Rendered track files by dive, result, format, variant and CRS (stored fixes never change). */
  trackCache?: RenderCache<PreparedFile> | undefined;
  /** Membership checks for the dive view outside an organisation's path. */
  membership?: MembershipCheck | undefined;
}

/** Which positions a download holds: as logged, smoothed, or re-solved. */
export type TrackVariant = 'raw' | 'cleaned' | 'resolved';

/** Report formats. */
export type ReportFormat = 'json' | 'md' | 'html';

async function projectOf(deps: DiveDeps, organisationId: string, projectId: string): Promise<ProjectRecord> {
  const project = await deps.projects.find(organisationId, projectId);
  if (project === undefined) throw new AppError('not-found', `No project ${projectId} in this organisation.`);
  return project;
}

async function logOf(deps: DiveDeps, projectId: string, logId: string): Promise<LogRecord> {
  const log = await deps.logs.find(projectId, logId);
  if (log === undefined) throw new AppError('not-found', `No log ${logId} in this project.`);
  return log;
}

async function diveOf(deps: DiveDeps, organisationId: string, projectId: string, diveId: string) {
  const project = await projectOf(deps, organisationId, projectId);
  const dive = await deps.dives.find(projectId, diveId);
  if (dive === undefined) throw new AppError('not-found', `No dive ${diveId} in this project.`);
  return { project, dive };
}

async function resultOf(deps: DiveDeps, dive: DiveRecord, resultId?: string): Promise<DiveResultRecord> {
  const id = resultId ?? dive.latestResultId;
  const result = id === null ? undefined : await deps.dives.result(dive.id, id);
  if (result === undefined) throw new AppError('not-found', `No result ${id ?? ''} of dive ${dive.id}.`);
  return result;
}

function unprocessable<T>(field: string, work: () => T): T {
  try {
    return work();
  } catch (error) {
    if (error instanceof LeadlineError) throw new AppError('unprocessable', error.message, { field });
    throw error;
  }
}

/**
 * Queues the first processing of a newly archived log with the project's audit profile and the
 * audit setup its default re-solve setup implies (the logged positions are audited as logged).
 */
export async function queueLogProcessing(
  deps: Pick<DiveDeps, 'projects' | 'runs' | 'queue'>,
  input: { organisationId: string; projectId: string; logId: string; actorUserId: string | null },
): Promise<RunRecord> {
  const project = await deps.projects.find(input.organisationId, input.projectId);
  if (project === undefined) throw new AppError('not-found', `No project ${input.projectId} in this organisation.`);
  const run = await deps.runs.create({
    projectId: input.projectId,
    logId: input.logId,
    kind: 'process',
    auditProfile: project.auditProfile,
    resolveSetup: null,
    auditSetup: auditSetupFromResolveSetup(project.defaultSetup),
    requestedBy: input.actorUserId,
  });
  try {
    await deps.queue?.enqueue(run, input.organisationId);
  } catch {
    // The log and its queued run are stored; a worker sends runs left without a job when it starts.
  }
  return run;
}

/** The dives of every project of an organisation, filtered, sorted and paged, with the total before paging. */
export async function listOrganisationDives(
  deps: Pick<DiveDeps, 'dives'>,
  query: OrganisationDiveQuery,
): Promise<{ dives: DiveRecord[]; total: number }> {
  return deps.dives.list(query);
}

/** A project's dives, filtered, sorted and paged, with the total before paging. */
export async function listDives(
  deps: DiveDeps,
  organisationId: string,
  query: DiveQuery,
): Promise<{ dives: DiveRecord[]; total: number }> {
  await projectOf(deps, organisationId, query.projectId);
  return deps.dives.list(query);
}

/** One dive with its latest result and how many runs it has had. */
export async function getDive(
  deps: DiveDeps,
  input: { organisationId: string; projectId: string; diveId: string },
): Promise<{ dive: DiveRecord; results: DiveResultRecord[] }> {
  const { dive } = await diveOf(deps, input.organisationId, input.projectId, input.diveId);
  return { dive, results: await deps.dives.results(dive.id) };
}

/** A log's processing runs, newest first (the first is its status). */
export async function listRuns(
  deps: DiveDeps,
  input: { organisationId: string; projectId: string; logId: string },
): Promise<RunRecord[]> {
  await projectOf(deps, input.organisationId, input.projectId);
  await logOf(deps, input.projectId, input.logId);
  return deps.runs.listForLog(input.logId);
}

/** The track of a variant: as stored, smoothed after the result's audit, or re-solved with the result's (or the project's) setup. */
async function variantTrack(
  deps: DiveDeps,
  project: ProjectRecord,
  dive: DiveRecord,
  variant: TrackVariant,
): Promise<{ vehicle: Track; surface: Track | undefined }> {
  const tracks = await deps.dives.tracks(dive.id);
  if (tracks === undefined) throw new AppError('not-found', `Dive ${dive.id} has no stored fixes.`);
  if (variant === 'raw') return tracks;
  const result = await resultOf(deps, dive);
  const profile = unprocessable('auditProfile', () => resolveAuditProfile(result.auditProfile));
  const auditSetup = unprocessable('auditSetup', () => parseAuditSetup(result.auditSetup));
  if (variant === 'cleaned') {
    const audit = auditTrack(tracks.vehicle, { profile, setup: auditSetup });
    const smoothed = smoothTrack(tracks.vehicle, {
      accelerationSigmaMps2: profile.smoothingAccelerationMps2,
      horizontal95M: audit.uncertainty.horizontal95M,
      flags: audit.flags,
    });
    return { vehicle: { ...smoothed.track, id: `${tracks.vehicle.id}-cleaned` }, surface: tracks.surface };
  }
  const setup = result.resolveSetup ?? project.defaultSetup;
  if (setup === null || setup === undefined)
    throw new AppError(
      'unprocessable',
      'No re-solve setup: give the project a default setup or reprocess the dive with one.',
      { field: 'variant' },
    );
  const resolved = unprocessable('setup', () =>
    resolveTrack(tracks.vehicle, setup, {
      ...(tracks.surface === undefined ? {} : { surfaceTrack: tracks.surface }),
      auditProfile: profile,
      auditSetup,
    }),
  );
  return { vehicle: resolved.track, surface: tracks.surface };
}

/** The cache key of a rendered track: raw fixes never change; cleaned and re-solved ones follow the latest result (and the project's setup). */
function trackKey(
  diveId: string,
  input: { format: TrackFormat; variant: TrackVariant; crs?: string | undefined },
  head: { latestResultId: string | null; defaultSetup: unknown; fileName: string },
): string {
  return [
    diveId,
    input.format,
    input.variant,
    input.crs?.toUpperCase() ?? '',
    input.variant === 'raw' ? '' : head.latestResultId,
    input.variant === 'resolved' ? JSON.stringify(head.defaultSetup) : '',
    head.fileName,
  ].join('|');
}

/**
 * A dive's track as a file ready to send: GPX, GeoJSON, CSV (optionally with a CRS) or KML; raw,
 * cleaned or re-solved. One indexed read names the file and keys the cache; the fixes are read and
 * written only when the cache does not hold that rendering yet.
 */
export async function downloadDiveTrack(
  deps: DiveDeps,
  input: {
    organisationId: string;
    projectId: string;
    diveId: string;
    format: TrackFormat;
    variant: TrackVariant;
    crs?: string | undefined;
  },
): Promise<PreparedFile> {
  const head = await deps.dives.trackHead(input.organisationId, input.projectId, input.diveId);
  if (head === undefined) {
    await diveOf(deps, input.organisationId, input.projectId, input.diveId); // says whether the project or the dive is missing
    throw new AppError('not-found', `No dive ${input.diveId} in this project.`);
  }
  const render = async () => {
    const { project, dive } = await diveOf(deps, input.organisationId, input.projectId, input.diveId);
    const { vehicle, surface } = await variantTrack(deps, project, dive, input.variant);
    const name = diveFileName(dive, input.variant);
    const rendered = renderTracks(
      { tracks: surface === undefined ? [vehicle] : [vehicle, surface], waypoints: [] },
      { format: input.format, crs: input.crs, name, nowMs: deps.now().getTime() },
    );
    const fileName = `${name}.${rendered.extension}`;
    const value = prepareFile({
      fileName,
      contentType: rendered.contentType,
      text: rendered.text,
      crsNote: rendered.crsNote,
    });
    // Keyed by what was rendered, should a new run have landed since the head was read.
    const key = trackKey(dive.id, input, {
      latestResultId: dive.latestResultId,
      defaultSetup: project.defaultSetup,
      fileName,
    });
    return { key, value };
  };
  const fileName = `${diveFileName(head, input.variant)}.${input.format}`;
  const key = trackKey(input.diveId, input, { ...head, fileName });
  if (deps.trackCache === undefined) return (await render()).value;
  return deps.trackCache.getOrCreate(key, render);
}

/** `<log name>-dive-<nn>[-cleaned|-resolved]`. */
export function diveFileName(dive: Pick<DiveRecord, 'logFileName' | 'diveNumber'>, variant: TrackVariant): string {
  const suffix = variant === 'raw' ? '' : `-${variant}`;
  return `${baseName(dive.logFileName)}-dive-${String(dive.diveNumber).padStart(2, '0')}${suffix}`;
}

/** A dive's audit report (latest result unless one is named) as JSON, Markdown or HTML. */
export async function downloadDiveReport(
  deps: DiveDeps,
  input: { organisationId: string; projectId: string; diveId: string; format: ReportFormat; resultId?: string },
): Promise<{ fileName: string; contentType: string; text: string }> {
  const { dive } = await diveOf(deps, input.organisationId, input.projectId, input.diveId);
  const result = await resultOf(deps, dive, input.resultId);
  const name = `${diveFileName(dive, 'raw')}.audit`;
  if (input.format === 'json')
    return { fileName: `${name}.json`, contentType: 'application/json', text: formatReportJson(result.report) };
  if (input.format === 'md')
    return {
      fileName: `${name}.md`,
      contentType: 'text/markdown; charset=utf-8',
      text: formatDiveReportMarkdown(result.report),
    };
  const tracks = await deps.dives.tracks(dive.id);
  const flags = await deps.dives.flags(result.id);
  if (tracks === undefined || flags === undefined)
    throw new AppError('not-found', `Dive ${dive.id} has no stored fixes.`);
  let audited = tracks.vehicle;
  if (result.resolveSetup !== null && result.resolveSetup !== undefined)
    audited = unprocessable('setup', () =>
      resolveTrack(
        tracks.vehicle,
        result.resolveSetup,
        tracks.surface === undefined ? {} : { surfaceTrack: tracks.surface },
      ),
    ).track;
  const plot = buildReportPlot(audited, flags.length === audited.length ? flags : new Uint16Array(audited.length));
  return {
    fileName: `${name}.html`,
    contentType: 'text/html; charset=utf-8',
    text: formatDiveReportHtml(result.report, plot),
  };
}

/** What a reprocess asks for; omitted fields take the project's settings (no setup: no re-solve). */
export interface ReprocessRequest {
  auditProfile?: string | undefined;
  /** A re-solve setup; the dive's positions are re-solved with it before the audit. */
  setup?: unknown;
  auditSetup?: unknown;
}

async function queueReprocess(
  deps: DiveDeps,
  input: {
    organisationId: string;
    project: ProjectRecord;
    logId: string;
    diveId: string | null;
    actorUserId: string;
    request: ReprocessRequest;
    /** `process` when the log has no dives yet (its first processing failed): read and split again. */
    kind?: 'process' | 'reprocess';
  },
): Promise<RunRecord> {
  const auditProfile = input.request.auditProfile ?? input.project.auditProfile;
  unprocessable('auditProfile', () => resolveAuditProfile(auditProfile));
  const setup = input.request.setup ?? null;
  const resolveSetup = setup === null ? null : unprocessable('setup', () => parseResolveSetup(setup));
  const auditSetup =
    input.request.auditSetup === undefined
      ? auditSetupFromResolveSetup(setup ?? input.project.defaultSetup)
      : (unprocessable('auditSetup', () => parseAuditSetup(input.request.auditSetup)) as Record<string, unknown>);
  const run = await deps.runs.create({
    projectId: input.project.id,
    logId: input.logId,
    diveId: input.diveId,
    kind: input.kind ?? 'reprocess',
    auditProfile,
    resolveSetup,
    auditSetup,
    requestedBy: input.actorUserId,
  });
  await deps.activity.append({
    organisationId: input.organisationId,
    actorUserId: input.actorUserId,
    action: 'reprocess-requested',
    subjectType: input.diveId === null ? 'log' : 'dive',
    subjectId: input.diveId ?? input.logId,
    details: { runId: run.id, auditProfile, resolve: resolveSetup !== null },
  });
  await deps.queue?.enqueue(run, input.organisationId);
  return run;
}

/** Queues a reprocess of one dive. */
export async function reprocessDive(
  deps: DiveDeps,
  input: { organisationId: string; projectId: string; diveId: string; actorUserId: string; request: ReprocessRequest },
): Promise<RunRecord> {
  const { project, dive } = await diveOf(deps, input.organisationId, input.projectId, input.diveId);
  return queueReprocess(deps, { ...input, project, logId: dive.logId, diveId: dive.id });
}

/**
 * Queues a reprocess of every dive of a log; a log without dives (its processing failed) is read and
 * split again. 409 while the log's processing is still queued or running.
 */
export async function reprocessLog(
  deps: DiveDeps,
  input: { organisationId: string; projectId: string; logId: string; actorUserId: string; request: ReprocessRequest },
): Promise<RunRecord> {
  const project = await projectOf(deps, input.organisationId, input.projectId);
  await logOf(deps, input.projectId, input.logId);
  const [latest] = await deps.runs.listForLog(input.logId);
  if (latest !== undefined && (latest.status === 'queued' || latest.status === 'processing'))
    throw new AppError(
      'conflict',
      `The log's last run is still ${latest.status}: wait until it is done, then reprocess.`,
    );
  const hasDives = (await deps.dives.diveIdsOfLog(input.logId)).length > 0;
  return queueReprocess(deps, { ...input, project, diveId: null, kind: hasDives ? 'reprocess' : 'process' });
}

/** Per input fix, the position a result audited: the re-solved one when its run re-solved, else the logged one. */
function positionsOf(
  tracks: { vehicle: Track; surface: Track | undefined },
  result: DiveResultRecord,
): { latDeg: Float64Array; lonDeg: Float64Array } {
  const { vehicle, surface } = tracks;
  if (result.resolveSetup === null || result.resolveSetup === undefined)
    return { latDeg: vehicle.columns.latDeg, lonDeg: vehicle.columns.lonDeg };
  const resolved = unprocessable('setup', () =>
    resolveTrack(vehicle, result.resolveSetup, surface === undefined ? {} : { surfaceTrack: surface }),
  );
  // Fixes the re-solve could not position stay NaN, so they are skipped rather than compared.
  const latDeg = new Float64Array(vehicle.length).fill(Number.NaN);
  const lonDeg = new Float64Array(vehicle.length).fill(Number.NaN);
  for (let k = 0; k < resolved.sourceIndex.length; k++) {
    const i = resolved.sourceIndex[k] as number;
    latDeg[i] = resolved.track.columns.latDeg[k] as number;
    lonDeg[i] = resolved.track.columns.lonDeg[k] as number;
  }
  return { latDeg, lonDeg };
}

/** How far one run moved a dive's positions from another run's, fix by fix. */
export interface ResultDisplacement {
  resultId: string;
  againstResultId: string;
  /** Fixes of the stored track. */
  fixCount: number;
  /** Horizontal geodesic distances (WGS 84) between the two runs' positions of the same fix, metres. */
  movement: MovementSummary;
}

/**
 * The horizontal displacement of a dive's positions between two of its results (by default the
 * result and the one just before it): per stored fix, the geodesic distance between the position
 * each run audited (re-solved or as logged); fixes either run could not position are skipped.
 */
export async function compareDiveResults(
  deps: DiveDeps,
  input: { organisationId: string; projectId: string; diveId: string; resultId: string; againstResultId?: string },
): Promise<ResultDisplacement> {
  const { dive } = await diveOf(deps, input.organisationId, input.projectId, input.diveId);
  const results = await deps.dives.results(dive.id);
  const at = results.findIndex((r) => r.id === input.resultId);
  const result = results[at];
  if (result === undefined) throw new AppError('not-found', `No result ${input.resultId} of dive ${dive.id}.`);
  let against: DiveResultRecord | undefined;
  if (input.againstResultId === undefined) {
    // Results come newest first: the one before is the next in the list.
    against = results[at + 1];
    if (against === undefined)
      throw new AppError(
        'not-found',
        `Result ${result.id} is the dive's first run: there is no earlier run to compare.`,
      );
  } else {
    against = results.find((r) => r.id === input.againstResultId);
    if (against === undefined)
      throw new AppError('not-found', `No result ${input.againstResultId} of dive ${dive.id}.`);
  }
  const tracks = await deps.dives.tracks(dive.id);
  if (tracks === undefined) throw new AppError('not-found', `Dive ${dive.id} has no stored fixes.`);
  const a = positionsOf(tracks, result);
  const b = positionsOf(tracks, against);
  const n = tracks.vehicle.length;
  const distancesM = new Float64Array(n).fill(Number.NaN);
  for (let i = 0; i < n; i++) {
    const latA = a.latDeg[i] as number;
    const lonA = a.lonDeg[i] as number;
    const latB = b.latDeg[i] as number;
    const lonB = b.lonDeg[i] as number;
    if (Number.isFinite(latA) && Number.isFinite(lonA) && Number.isFinite(latB) && Number.isFinite(lonB))
      distancesM[i] = geodesicDistanceM(latA, lonA, latB, lonB);
  }
  return { resultId: result.id, againstResultId: against.id, fixCount: n, movement: summariseMovement(distancesM) };
}
