import { type AuditContext, SPREAD_HALF_WIDTH } from '../audit-context.js';
import type { Finding } from '../finding.js';
import { findingsFromRuns, fixesDo, formatValue } from '../findings-from-runs.js';
import { measuredBuffer } from '../measured-buffer.js';
import { localMedian } from '../robust-window.js';

/**
 * Position jumps judged against neighbours: a fix is a jump when its distance from the median
 * position of its 8 neighbours exceeds both `profile.jumpFloorM` and `profile.jumpSpreadFactor`
 * times the local spread (the median distance of the 32 neighbours around it), so the limit follows the
 * local noise (longer range, noisier fixes) instead of one threshold for the whole log. Flags the
 * fix; runs are `warn` findings (`fail` past `profile.flaggedShareFail`), measured the largest
 * distance and limit the floor.
 */
export function checkPositionJumps(context: AuditContext): Finding[] {
  const { n, profile, residualM } = context;
  const measured = measuredBuffer(context);
  let worstLimit = profile.jumpFloorM;
  for (let i = 0; i < n; i++) {
    const r = residualM[i] as number;
    if (!(r > profile.jumpFloorM)) continue;
    // the local spread, only for the few fixes past the floor (a median of 32 per candidate)
    const spread = localMedian(residualM, i, SPREAD_HALF_WIDTH);
    const limit = Number.isNaN(spread)
      ? profile.jumpFloorM
      : Math.max(profile.jumpFloorM, profile.jumpSpreadFactor * spread);
    if (r > limit) {
      measured[i] = r;
      if (limit > worstLimit) worstLimit = limit;
    }
  }
  return findingsFromRuns(context, 'position-jump', measured, {
    limit: profile.jumpFloorM,
    unit: 'm',
    describe: (worst, count) =>
      `${fixesDo(count, 'jumps', 'jump')} up to ${formatValue(worst)} m away from the track around them (limit ${formatValue(profile.jumpFloorM)} m or ${formatValue(profile.jumpSpreadFactor)}× the local spread); likely acoustic outliers such as multipath.`,
  });
}
