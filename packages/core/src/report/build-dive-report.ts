import type { AuditResult } from '../audit/audit-track.js';
import type { CheckName, Severity, Verdict } from '../audit/finding.js';
import type { S44Order } from '../audit/s44-orders.js';
import type { Track } from '../model/track.js';
import type { DiveSummary } from '../summarise/summarise-dive.js';
import { summariseDive } from '../summarise/summarise-dive.js';
import { LEADLINE_VERSION } from '../version.js';
import { SAFETY_CAUTION } from './safety-caution.js';

/** A finding as reports carry it: times as ISO 8601 UTC, values rounded, `null` for none. */
export interface ReportFinding {
  check: CheckName;
  severity: Severity;
  startIndex: number;
  endIndex: number;
  startTime: string | null;
  endTime: string | null;
  measured: number | null;
  limit: number | null;
  unit: string;
  message: string;
}

/** The audit report of one dive (schema `leadline/dive-report@1`, documented in report/README.md). */
export interface DiveReport {
  schema: 'leadline/dive-report@1';
  leadlineVersion: string;
  /** The log file the dive came from, as the caller named it. */
  file: string;
  trackId: string;
  profile: string;
  verdict: Verdict;
  /** The verdict rule, in words. */
  verdictRule: string;
  fixCount: number;
  flaggedCount: number;
  /** flaggedCount / fixCount, 0–1 (0 for an empty dive). */
  flaggedShare: number;
  findingCounts: Record<Severity, number>;
  findings: ReportFinding[];
  /** From `summariseDive`. */
  summary: DiveSummary;
  /** Per-fix horizontal uncertainty at 95 % over the unflagged fixes, metres (`null` when unknown). */
  horizontalUncertainty95M: { median: number | null; p95: number | null; max: number | null };
  /** Share of unflagged fixes meeting each IHO S-44 Ed. 6.0.0 order. */
  s44: Array<{ order: S44Order; judged: number; meeting: number; share: number | null }>;
  caution: string;
}

/** The rule `decideVerdict` applies, as reports state it. */
export const VERDICT_RULE =
  'fail when any finding is fail; otherwise warn when any finding is warn; otherwise pass (info findings never change the verdict)';

function round(value: number, decimals: number): number | null {
  if (!Number.isFinite(value)) return null;
  const f = 10 ** decimals;
  return Math.round(value * f) / f + 0;
}

function isoTime(ms: number): string | null {
  return Number.isFinite(ms) ? new Date(ms).toISOString() : null;
}

function quantiles(
  values: Float64Array,
  flags: Uint16Array,
): { median: number | null; p95: number | null; max: number | null } {
  const stride = Math.max(1, Math.floor(values.length / 100_000)); // a sample is plenty on long logs
  const sample = new Float64Array(Math.ceil(values.length / stride));
  let count = 0;
  for (let i = 0; i < values.length; i += stride) {
    const v = values[i] as number;
    if (flags[i] === 0 && !Number.isNaN(v)) sample[count++] = v;
  }
  if (count === 0) return { median: null, p95: null, max: null };
  // A typed array sorts numerically without a comparator call per comparison.
  const picked = sample.subarray(0, count).sort();
  const at = (q: number) => picked[Math.min(count - 1, Math.floor(q * (count - 1) + 0.5))] as number;
  return { median: round(at(0.5), 3), p95: round(at(0.95), 3), max: round(picked[count - 1] as number, 3) };
}

/** What `buildDiveReport` needs. */
export interface DiveReportInput {
  file: string;
  track: Track;
  audit: AuditResult;
  /** The surface unit's own track, for the summary's ranges when the vehicle fixes carry none. */
  surface?: Track;
}

/**
 * Builds the JSON-ready audit report of one dive: verdict and its rule, findings with ISO times,
 * flagged counts, the dive summary (`summariseDive` with the audit's flags), the 95 % horizontal
 * uncertainty distribution, the S-44 shares and the safety caution. Numbers are rounded (metres
 * to mm, shares to 4 decimals); unknown values are `null`, never `NaN`.
 */
export function buildDiveReport(input: DiveReportInput): DiveReport {
  const { track, audit } = input;
  const flagged = new Uint8Array(track.length);
  for (let i = 0; i < track.length; i++) flagged[i] = audit.flags[i] === 0 ? 0 : 1;
  const summary = summariseDive(track, input.surface === undefined ? { flagged } : { flagged, surface: input.surface });
  const findingCounts: Record<Severity, number> = { info: 0, warn: 0, fail: 0 };
  for (const f of audit.findings) findingCounts[f.severity]++;
  return {
    schema: 'leadline/dive-report@1',
    leadlineVersion: LEADLINE_VERSION,
    file: input.file,
    trackId: track.id,
    profile: audit.profile,
    verdict: audit.verdict,
    verdictRule: VERDICT_RULE,
    fixCount: track.length,
    flaggedCount: audit.flaggedCount,
    flaggedShare: track.length === 0 ? 0 : (round(audit.flaggedCount / track.length, 4) ?? 0),
    findingCounts,
    findings: audit.findings.map((f) => ({
      check: f.check,
      severity: f.severity,
      startIndex: f.startIndex,
      endIndex: f.endIndex,
      startTime: isoTime(f.startTimeMs),
      endTime: isoTime(f.endTimeMs),
      measured: round(f.measured, 3),
      limit: round(f.limit, 3),
      unit: f.unit,
      message: f.message,
    })),
    summary,
    horizontalUncertainty95M: quantiles(audit.uncertainty.horizontal95M, audit.flags),
    s44: audit.s44.map((s) => ({ order: s.order, judged: s.judged, meeting: s.meeting, share: round(s.share, 4) })),
    caution: SAFETY_CAUTION,
  };
}
