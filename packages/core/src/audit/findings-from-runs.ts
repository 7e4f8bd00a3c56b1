import { type AuditContext, FLAG_BITS } from './audit-context.js';
import type { CheckName, Finding, Severity } from './finding.js';

/** How `findingsFromRuns` turns per-fix measurements into findings. */
export interface RunOptions {
  limit: number;
  unit: string;
  /** Builds the message from the worst value over the run and the number of fixes in it. */
  describe: (worst: number, count: number) => string;
  /** Fixed severity; when omitted: `warn`, or `fail` when the check flags more than `profile.flaggedShareFail` of the fixes. */
  severity?: Severity;
  /** Set the check's bit in `context.flags` for each fix in a run (default true when the check has a bit). */
  flag?: boolean;
  /** `min` when a smaller value is worse (fix rate); default `max`. */
  worst?: 'max' | 'min';
  /** Last fix a measurement at fix i depends on, when later than i (speed over a time base). */
  spanEnd?: Int32Array;
}

/**
 * Groups consecutive fixes whose `measured` value is not `NaN` into runs and returns one finding
 * per run, spanning its first to last fix, with the worst value of the run.
 */
export function findingsFromRuns(
  context: AuditContext,
  check: CheckName,
  measured: Float64Array,
  options: RunOptions,
): Finding[] {
  const { n, track, profile } = context;
  const time = track.columns.timeMs;
  const bit = FLAG_BITS[check] ?? 0;
  const flag = options.flag ?? bit !== 0;
  let flaggedCount = 0;
  for (let i = 0; i < n; i++) if (!Number.isNaN(measured[i] as number)) flaggedCount++;
  if (flaggedCount === 0) return [];
  const severity: Severity =
    options.severity ?? (n > 0 && flaggedCount / n > profile.flaggedShareFail ? 'fail' : 'warn');
  const useMin = options.worst === 'min';
  const findings: Finding[] = [];
  let i = 0;
  while (i < n) {
    if (Number.isNaN(measured[i] as number)) {
      i++;
      continue;
    }
    const start = i;
    let worst = measured[i] as number;
    let spanEnd = i;
    while (i < n && !Number.isNaN(measured[i] as number)) {
      const v = measured[i] as number;
      if (useMin ? v < worst : v > worst) worst = v;
      const reach = options.spanEnd === undefined ? i : (options.spanEnd[i] as number);
      if (reach > spanEnd) spanEnd = reach;
      if (i > spanEnd) spanEnd = i;
      if (flag) context.flags[i] = (context.flags[i] as number) | bit;
      i++;
    }
    const end = Math.min(n - 1, Math.max(i - 1, spanEnd));
    findings.push({
      check,
      severity,
      startIndex: start,
      endIndex: end,
      startTimeMs: time[start] as number,
      endTimeMs: time[end] as number,
      measured: worst,
      limit: options.limit,
      unit: options.unit,
      message: options.describe(worst, i - start),
    });
  }
  return findings;
}

/** Formats a number for a message with at most `decimals` decimals and no trailing zeros. */
export function formatValue(value: number, decimals = 1): string {
  if (!Number.isFinite(value)) return String(value);
  return String(Number(value.toFixed(decimals)));
}

/** "1 fix" / "3 fixes". */
export function fixCount(count: number): string {
  return count === 1 ? '1 fix' : `${count} fixes`;
}

/** "1 fix jumps" / "3 fixes jump": the count with its noun and a verb that agrees. */
export function fixesDo(count: number, singularVerb: string, pluralVerb: string): string {
  return count === 1 ? `1 fix ${singularVerb}` : `${count} fixes ${pluralVerb}`;
}
