import type { AuditContext } from '../audit-context.js';
import type { Finding } from '../finding.js';
import { findingsFromRuns, fixCount, formatValue } from '../findings-from-runs.js';

/**
 * Position jumps judged against neighbours: a fix is a jump when its distance from the median
 * position of its 8 neighbours exceeds both `profile.jumpFloorM` and `profile.jumpSpreadFactor`
 * times the local spread (the median of the neighbours' own distances), so the limit follows the
 * local noise (longer range, noisier fixes) instead of one threshold for the whole log. Flags the
 * fix; runs are `warn` findings (`fail` past `profile.flaggedShareFail`), measured the largest
 * distance and limit the floor.
 */
export function checkPositionJumps(context: AuditContext): Finding[] {
  const { n, profile, residualM, spreadM } = context;
  const measured = new Float64Array(n).fill(Number.NaN);
  let worstLimit = profile.jumpFloorM;
  for (let i = 0; i < n; i++) {
    const r = residualM[i] as number;
    if (!(r > profile.jumpFloorM)) continue;
    const spread = spreadM[i] as number;
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
      `${fixCount(count)} jump up to ${formatValue(worst)} m away from the track around them (limit ${formatValue(profile.jumpFloorM)} m or ${formatValue(profile.jumpSpreadFactor)}× the local spread); likely acoustic outliers such as multipath.`,
  });
}
