import type { AuditContext } from '../audit-context.js';
import type { Finding } from '../finding.js';
import { formatValue } from '../findings-from-runs.js';

/**
 * Time gaps: consecutive fixes further apart in time than `profile.gapWarnS` give a `warn`
 * finding, beyond `profile.gapFailS` a `fail`. The finding spans the two fixes either side of the
 * gap; no fix is flagged (neither is wrong, the track between them is simply unknown).
 */
export function checkTimeGaps(context: AuditContext): Finding[] {
  const { n, profile } = context;
  const time = context.track.columns.timeMs;
  const findings: Finding[] = [];
  for (let i = 1; i < n; i++) {
    const gapS = ((time[i] as number) - (time[i - 1] as number)) / 1000;
    if (!(gapS > profile.gapWarnS)) continue;
    const fail = gapS > profile.gapFailS;
    findings.push({
      check: 'time-gap',
      severity: fail ? 'fail' : 'warn',
      startIndex: i - 1,
      endIndex: i,
      startTimeMs: time[i - 1] as number,
      endTimeMs: time[i] as number,
      measured: gapS,
      limit: fail ? profile.gapFailS : profile.gapWarnS,
      unit: 's',
      message: `No fix for ${formatValue(gapS)} s (more than ${formatValue(fail ? profile.gapFailS : profile.gapWarnS)} s); the track is unknown in between.`,
    });
  }
  return findings;
}
