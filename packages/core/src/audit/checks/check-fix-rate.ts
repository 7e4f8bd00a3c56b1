import type { AuditContext } from '../audit-context.js';
import type { Finding } from '../finding.js';
import { formatValue } from '../findings-from-runs.js';

/**
 * Fix rate below expectation: the log is cut into consecutive windows of
 * `profile.fixRateWindowS` (the whole log when shorter) and a window holding fewer fixes per
 * second than `profile.minFixRateHz` is low; consecutive low windows make one `warn` finding with
 * the lowest rate. A dive of fewer than two fixes is a `warn` of its own.
 */
export function checkFixRate(context: AuditContext): Finding[] {
  const { n, profile } = context;
  const time = context.track.columns.timeMs;
  if (n < 2) {
    return [
      {
        check: 'low-fix-rate',
        severity: 'warn',
        startIndex: 0,
        endIndex: Math.max(0, n - 1),
        startTimeMs: n > 0 ? (time[0] as number) : Number.NaN,
        endTimeMs: n > 0 ? (time[0] as number) : Number.NaN,
        measured: n,
        limit: 2,
        unit: 'fixes',
        message: `Only ${n} fix${n === 1 ? '' : 'es'}: too few to judge or use as a track.`,
      },
    ];
  }
  const startMs = time[0] as number;
  const endMs = time[n - 1] as number;
  const windowMs = profile.fixRateWindowS * 1000;
  const findings: Finding[] = [];
  const durationMs = endMs - startMs;
  if (!(durationMs > 0)) return findings;
  const windows = Math.max(1, Math.floor(durationMs / windowMs));
  // windows of equal length covering [startMs, endMs]; the last one absorbs the remainder
  const lengthMs = durationMs / windows;
  let i = 0;
  let open: Finding | undefined;
  for (let w = 0; w < windows; w++) {
    const from = startMs + w * lengthMs;
    const to = w === windows - 1 ? endMs + 1 : from + lengthMs;
    const first = i;
    while (i < n && (time[i] as number) < to) i++;
    const count = i - first;
    const rateHz = count / (lengthMs / 1000);
    if (rateHz < profile.minFixRateHz) {
      const last = Math.max(first, i - 1);
      if (open === undefined) {
        open = {
          check: 'low-fix-rate',
          severity: 'warn',
          startIndex: first > 0 ? first - 1 : 0,
          endIndex: last,
          startTimeMs: from,
          endTimeMs: Math.min(to, endMs),
          measured: rateHz,
          limit: profile.minFixRateHz,
          unit: 'Hz',
          message: '',
        };
        findings.push(open);
      } else {
        open.endIndex = last;
        open.endTimeMs = Math.min(to, endMs);
        open.measured = Math.min(open.measured, rateHz);
      }
    } else open = undefined;
  }
  for (const finding of findings) {
    const minutes = (finding.endTimeMs - finding.startTimeMs) / 60000;
    finding.message = `Fix rate fell to ${formatValue(finding.measured, 3)} fixes/s over ${formatValue(minutes)} min (expected at least ${formatValue(profile.minFixRateHz, 3)}); a weak or blocked acoustic link.`;
  }
  return findings;
}
