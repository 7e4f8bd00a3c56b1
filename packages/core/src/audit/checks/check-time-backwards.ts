import type { AuditContext } from '../audit-context.js';
import type { Finding } from '../finding.js';
import { findingsFromRuns, fixCount, formatValue } from '../findings-from-runs.js';
import { measuredBuffer } from '../measured-buffer.js';

/**
 * Time going backwards: a fix stamped earlier than the latest time seen before it. The fix is
 * flagged and each run of such fixes is a `fail` finding (the log's order or clock cannot be
 * trusted); measured is how far back the time went, seconds.
 */
export function checkTimeBackwards(context: AuditContext): Finding[] {
  const { n } = context;
  const time = context.track.columns.timeMs;
  const measured = measuredBuffer(context);
  let latest = Number.NEGATIVE_INFINITY;
  for (let i = 0; i < n; i++) {
    const t = time[i] as number;
    if (t < latest) measured[i] = (latest - t) / 1000;
    else if (t > latest) latest = t;
  }
  return findingsFromRuns(context, 'time-backwards', measured, {
    limit: 0,
    unit: 's',
    severity: 'fail',
    describe: (worst, count) =>
      `Time goes backwards at ${fixCount(count)} (by up to ${formatValue(worst, 3)} s); the log's clock or row order is broken.`,
  });
}
