import type { AuditContext } from '../audit-context.js';
import type { Finding } from '../finding.js';
import { findingsFromRuns, fixesDo } from '../findings-from-runs.js';
import { measuredBuffer } from '../measured-buffer.js';

/**
 * Repeated timestamps: a fix with the same time as the fix before it is flagged; each run is a
 * `warn` finding (`fail` past `profile.flaggedShareFail`). Measured is the number of fixes sharing
 * the time, limit 1.
 */
export function checkRepeatedTimes(context: AuditContext): Finding[] {
  const { n } = context;
  const time = context.track.columns.timeMs;
  const measured = measuredBuffer(context);
  let sameCount = 1;
  for (let i = 1; i < n; i++) {
    if (time[i] === time[i - 1]) {
      sameCount++;
      measured[i] = sameCount;
    } else sameCount = 1;
  }
  return findingsFromRuns(context, 'repeated-time', measured, {
    limit: 1,
    unit: 'fixes',
    describe: (_worst, count) =>
      `${fixesDo(count, 'repeats', 'repeat')} the timestamp of the fix before; a logger or clock glitch.`,
  });
}
