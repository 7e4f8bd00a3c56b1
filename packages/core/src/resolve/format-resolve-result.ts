import type { ResolveSetup } from './resolve-setup.js';
import type { AppliedSetup, AuditOutcome, ResolveResult } from './resolve-track.js';
import type { MovementSummary } from './summarise-movement.js';

/** A re-solve result as plain JSON: rounded, `null` for a missing number, per-fix rows optional. */
export interface ResolveReport {
  track: string;
  setup: ResolveSetup;
  applied: {
    bearingReference: AppliedSetup['bearingReference'];
    bearingReferenceFrom: AppliedSetup['bearingReferenceFrom'];
    declinationDeg: number;
    declinationModel: AppliedSetup['declinationModel'] | null;
    waterSoundSpeedMinMps: number | null;
    waterSoundSpeedMaxMps: number | null;
  };
  fixCount: number;
  resolvedCount: number;
  rejectedCount: number;
  /** Metres moved, logged → re-solved. */
  moved: {
    comparedCount: number;
    medianM: number | null;
    p95M: number | null;
    maxM: number | null;
    meanM: number | null;
  };
  audit: { profile: string; logged: AuditOutcome; resolved: AuditOutcome };
  rejections: { line: number; time: string | null; reason: string; message: string }[];
  /** One row per input fix, when asked for: its re-solved position or why it has none. */
  fixes?: {
    line: number;
    time: string | null;
    latDeg: number | null;
    lonDeg: number | null;
    movedM: number | null;
    rejected: string | null;
  }[];
}

/**
 * Turns a `resolveTrack` result into the plain JSON report the CLI prints and the golden fixtures
 * hold: positions to 1e-9° (0.1 mm), metres to 1 mm, sound speeds to 0.001 m/s, degrees to 1e-6;
 * `NaN` becomes `null`; times are ISO 8601 UTC. With `fixes: true` it lists every input fix.
 */
export function formatResolveResult(result: ResolveResult, options: { fixes?: boolean } = {}): ResolveReport {
  const { comparison, applied } = result;
  const input = result.track.provenance;
  const report: ResolveReport = {
    track: input.resolvedFrom,
    setup: result.setup,
    applied: {
      bearingReference: applied.bearingReference,
      bearingReferenceFrom: applied.bearingReferenceFrom,
      declinationDeg: round(applied.declinationDeg, 6) ?? 0,
      declinationModel:
        applied.declinationModel === undefined
          ? null
          : {
              ...applied.declinationModel,
              decimalYear: round(applied.declinationModel.decimalYear, 6) ?? 0,
            },
      waterSoundSpeedMinMps: round(applied.waterSoundSpeedMinMps, 3),
      waterSoundSpeedMaxMps: round(applied.waterSoundSpeedMaxMps, 3),
    },
    fixCount: comparison.fixCount,
    resolvedCount: comparison.resolvedCount,
    rejectedCount: comparison.rejectedCount,
    moved: movement(comparison.summary),
    audit: comparison.audit,
    rejections: result.rejections.map((r) => ({
      line: r.line,
      time: isoTime(r.timeMs),
      reason: r.reason,
      message: r.message,
    })),
  };
  if (options.fixes === true) {
    const rejectedAt = new Map(result.rejections.map((r) => [r.index, r]));
    const outputAt = new Map<number, number>();
    result.sourceIndex.forEach((source, k) => {
      outputAt.set(source, k);
    });
    const { latDeg, lonDeg, timeMs } = result.track.columns;
    report.fixes = Array.from(comparison.movedM, (moved, i) => {
      const k = outputAt.get(i);
      const rejection = rejectedAt.get(i);
      if (k === undefined)
        return {
          line: rejection?.line ?? 0,
          time: isoTime(rejection?.timeMs ?? Number.NaN),
          latDeg: null,
          lonDeg: null,
          movedM: null,
          rejected: rejection?.reason ?? null,
        };
      return {
        line: result.track.sourceLines[k] ?? 0,
        time: isoTime(timeMs[k] as number),
        latDeg: round(latDeg[k] as number, 9),
        lonDeg: round(lonDeg[k] as number, 9),
        movedM: round(moved, 3),
        rejected: null,
      };
    });
  }
  return report;
}

function movement(summary: MovementSummary): ResolveReport['moved'] {
  return {
    comparedCount: summary.comparedCount,
    medianM: round(summary.medianM, 3),
    p95M: round(summary.p95M, 3),
    maxM: round(summary.maxM, 3),
    meanM: round(summary.meanM, 3),
  };
}

function round(value: number, decimals: number): number | null {
  if (!Number.isFinite(value)) return null;
  const scale = 10 ** decimals;
  return Math.round(value * scale) / scale + 0;
}

function isoTime(timeMs: number): string | null {
  return Number.isFinite(timeMs) ? new Date(timeMs).toISOString() : null;
}
