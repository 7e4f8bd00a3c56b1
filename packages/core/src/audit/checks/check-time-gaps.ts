import type { AuditContext } from '../audit-context.js';
import type { Finding } from '../finding.js';
import { formatValue } from '../findings-from-runs.js';

/** The log's usual interval between fixes: the median of the positive steps (a sample of them on long logs), seconds. */
export function typicalIntervalS(time: Float64Array): number {
  const steps: number[] = [];
  const stride = Math.max(1, Math.floor(time.length / 5000));
  for (let i = stride; i < time.length; i += stride) {
    const dt = (time[i] as number) - (time[i - 1] as number);
    if (dt > 0) steps.push(dt);
  }
  if (steps.length === 0) return Number.NaN;
  steps.sort((a, b) => a - b);
  return (steps[steps.length >> 1] as number) / 1000;
}

/**
 * Time gaps: a fix later than the latest time before it by more than `profile.gapFactor` times the
 * log's own typical interval is an `info` finding (a few missed updates), by more than
 * `profile.gapWarnS` a `warn`, by more than `profile.gapFailS` a `fail`. The finding spans the
 * fixes either side of the gap; no fix is flagged (neither is wrong, the track between them is
 * simply unknown). Times that go backwards are the time-backwards check's business.
 */
export function checkTimeGaps(context: AuditContext): Finding[] {
  const { n, profile } = context;
  const time = context.track.columns.timeMs;
  const findings: Finding[] = [];
  const infoS = Math.min(profile.gapWarnS, profile.gapFactor * typicalIntervalS(time));
  let latestIndex = 0;
  for (let i = 1; i < n; i++) {
    const latest = time[latestIndex] as number;
    const t = time[i] as number;
    if (!(t > latest)) continue;
    const gapS = (t - latest) / 1000;
    const previous = latestIndex;
    latestIndex = i;
    if (!(gapS > infoS)) continue;
    const severity = gapS > profile.gapFailS ? 'fail' : gapS > profile.gapWarnS ? 'warn' : 'info';
    const limit = severity === 'fail' ? profile.gapFailS : severity === 'warn' ? profile.gapWarnS : infoS;
    findings.push({
      check: 'time-gap',
      severity,
      startIndex: previous,
      endIndex: i,
      startTimeMs: latest,
      endTimeMs: t,
      measured: gapS,
      limit,
      unit: 's',
      message: `No fix for ${formatValue(gapS)} s (more than ${formatValue(limit)} s); the track is unknown in between.`,
    });
  }
  return findings;
}
