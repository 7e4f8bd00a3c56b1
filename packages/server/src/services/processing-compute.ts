// The CPU-heavy part of processing (read, split, audit, summarise) on plain, structured-cloneable
// data, so that it can run on a worker thread (jobs/processing-threads.ts) as well as in this one.
import {
  type AuditProfile,
  type AuditSetup,
  auditTrack,
  buildDiveReport,
  formatRejection,
  InvalidArgumentError,
  LeadlineError,
  parseAuditSetup,
  readLog,
  resolveAuditProfile,
  resolveTrack,
  splitDives,
  type Track,
  takeFixes,
} from '@leadline/core';
import type { NewDive, NewDiveResult } from '../stores/dive-store.js';

/** A failure that another attempt cannot fix (an unreadable log, an unknown profile): the run fails at once. */
export class PermanentProcessingError extends Error {
  override readonly name = 'PermanentProcessingError';
}

/**
 * What a computation ends with. A permanent failure is a value, not a thrown error, because an
 * error's class does not survive the trip back from a worker thread; anything thrown is retried.
 */
export type ComputeOutcome<T> = { ok: true; value: T } | { ok: false; permanent: string };

/** The settings of a run, as stored on it. */
export interface RunSettings {
  auditProfile: string;
  auditSetup: unknown;
  resolveSetup: unknown;
}

/** A `process` run's input: the log's bytes and name, the project's time zone and CRS. */
export interface ProcessInput extends RunSettings {
  fileName: string;
  content: Uint8Array;
  timeZone: string;
  inputCrs: string | null;
}

/** A `reprocess` run's input: the stored dives' tracks. */
export interface ReprocessInput extends RunSettings {
  fileName: string;
  dives: Array<{ diveId: string; vehicle: Track; surface: Track | undefined }>;
}

/** One dive's new result. */
export interface ReprocessedDive {
  diveId: string;
  result: NewDiveResult;
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

function asOutcome<T>(work: () => T): ComputeOutcome<T> {
  try {
    return { ok: true, value: work() };
  } catch (error) {
    if (error instanceof PermanentProcessingError) return { ok: false, permanent: error.message };
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

function settingsOf(input: RunSettings) {
  return {
    profile: permanent('audit profile', () => resolveAuditProfile(input.auditProfile)),
    auditSetup: permanent('audit setup', () => parseAuditSetup(input.auditSetup)),
  };
}

/**
 * A `process` run's work: reads the log (local times in the project's zone, projected coordinates
 * in its CRS), splits each vehicle track into dives with the profile's settings, audits and
 * summarises each.
 */
export function computeProcess(input: ProcessInput): ComputeOutcome<NewDive[]> {
  return asOutcome(() => {
    const { profile, auditSetup } = settingsOf(input);
    const read = permanent('reading the log', () =>
      readLog(
        { fileName: input.fileName, content: input.content },
        { timeZone: input.timeZone, ...(input.inputCrs === null ? {} : { inputCrs: input.inputCrs }) },
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
          fileName: input.fileName,
          vehicle: track,
          surface: diveSurface,
          profile,
          auditSetup,
          resolveSetup: input.resolveSetup,
        });
        dives.push({ diveNumber: dives.length + 1, vehicle: track, surface: diveSurface, result });
      }
    }
    return dives;
  });
}

/** A `reprocess` run's work: audits the stored dives again (re-solving first when the run has a setup). */
export function computeReprocess(input: ReprocessInput): ComputeOutcome<ReprocessedDive[]> {
  return asOutcome(() => {
    const { profile, auditSetup } = settingsOf(input);
    return input.dives.map(({ diveId, vehicle, surface }) => ({
      diveId,
      result: computeDiveResult({
        fileName: input.fileName,
        vehicle,
        surface,
        profile,
        auditSetup,
        resolveSetup: input.resolveSetup,
      }).result,
    }));
  });
}

/** Checks that the thread has loaded this module (a pool warms up with it). */
export function ready(): boolean {
  return true;
}
