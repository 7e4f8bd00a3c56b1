import type { AuditContext } from '../audit-context.js';
import { NEIGHBOUR_HALF_WIDTH, SPREAD_HALF_WIDTH } from '../audit-context.js';
import type { Finding } from '../finding.js';
import { findingsFromRuns, fixCount, formatValue } from '../findings-from-runs.js';
import { measuredBuffer } from '../measured-buffer.js';
import { localMedian, neighbourMedian } from '../robust-window.js';

/**
 * Depth jumps: a depth farther from its 8 neighbours' median depth than both
 * `profile.depthJumpFloorM` plus what `profile.maxVerticalSpeedMps` allows over the time to the
 * nearer neighbour, and `profile.jumpSpreadFactor` times the local spread (median residual of the 32 neighbours). Flags the fix; runs are
 * `warn` findings (`fail` past `profile.flaggedShareFail`).
 */
export function checkDepthJumps(context: AuditContext): Finding[] {
  const { n, profile } = context;
  const { depthM, timeMs } = context.track.columns;
  const median = neighbourMedian(depthM, NEIGHBOUR_HALF_WIDTH, new Float64Array(n));
  const residual = new Float64Array(n);
  for (let i = 0; i < n; i++) residual[i] = Math.abs((depthM[i] as number) - (median[i] as number));
  const measured = measuredBuffer(context);
  for (let i = 0; i < n; i++) {
    const r = residual[i] as number;
    if (!(r > profile.depthJumpFloorM)) continue;
    const before = i > 0 ? (timeMs[i] as number) - (timeMs[i - 1] as number) : Number.POSITIVE_INFINITY;
    const after = i < n - 1 ? (timeMs[i + 1] as number) - (timeMs[i] as number) : Number.POSITIVE_INFINITY;
    const dtS = Math.max(0, Math.min(before, after)) / 1000;
    const allowed = profile.depthJumpFloorM + (Number.isFinite(dtS) ? profile.maxVerticalSpeedMps * dtS : 0);
    const s = localMedian(residual, i, SPREAD_HALF_WIDTH);
    const limit = Number.isNaN(s) ? allowed : Math.max(allowed, profile.jumpSpreadFactor * s);
    if (r > limit) measured[i] = r;
  }
  return findingsFromRuns(context, 'depth-jump', measured, {
    limit: profile.depthJumpFloorM,
    unit: 'm',
    describe: (worst, count) =>
      `${fixCount(count)} with a depth up to ${formatValue(worst)} m off the depths around them (faster than ${formatValue(profile.maxVerticalSpeedMps)} m/s vertically); a depth sensor or telemetry glitch.`,
  });
}
