import type { AuditContext } from '../audit-context.js';
import type { Finding } from '../finding.js';
import { findingsFromRuns, formatValue } from '../findings-from-runs.js';
import { measuredBuffer } from '../measured-buffer.js';

/**
 * For each fix i, the first later fix at least `baselineS` later whose robust local position is
 * known, or -1. Robust local positions (neighbour medians) keep one wild fix from faking speed.
 */
export function findBaselinePartners(context: AuditContext, baselineS: number): Int32Array {
  const { n, medianEastM } = context;
  const time = context.track.columns.timeMs;
  const partner = new Int32Array(n).fill(-1);
  const baselineMs = baselineS * 1000;
  let j = 0;
  for (let i = 0; i < n; i++) {
    if (Number.isNaN(medianEastM[i] as number)) continue;
    const ti = time[i] as number;
    if (j <= i) j = i + 1;
    while (j < n && !((time[j] as number) - ti >= baselineMs)) j++;
    let k = j;
    while (k < n && Number.isNaN(medianEastM[k] as number)) k++;
    if (k < n) partner[i] = k;
  }
  return partner;
}

/**
 * Implied speed beyond the platform's limit: the horizontal speed between robust local positions
 * (neighbour medians) `profile.speedBaselineS` apart, so single outliers (the position-jump
 * check's business) and metre-level noise do not count. Runs above `profile.maxSpeedMps` are
 * findings spanning the fixes involved; no fix is flagged (which one is wrong is not knowable).
 */
export function checkImpliedSpeed(context: AuditContext): Finding[] {
  const { n, profile, medianEastM, medianNorthM } = context;
  const time = context.track.columns.timeMs;
  const partner = findBaselinePartners(context, profile.speedBaselineS);
  const measured = measuredBuffer(context);
  for (let i = 0; i < n; i++) {
    const j = partner[i] as number;
    if (j < 0) continue;
    const de = (medianEastM[j] as number) - (medianEastM[i] as number);
    const dn = (medianNorthM[j] as number) - (medianNorthM[i] as number);
    const speed = Math.sqrt(de * de + dn * dn) / (((time[j] as number) - (time[i] as number)) / 1000);
    if (speed > profile.maxSpeedMps) measured[i] = speed;
  }
  return findingsFromRuns(context, 'too-fast', measured, {
    limit: profile.maxSpeedMps,
    unit: 'm/s',
    flag: false,
    spanEnd: partner,
    severity: 'warn',
    describe: (worst) =>
      `The track implies ${formatValue(worst, 2)} m/s, faster than this platform moves (${formatValue(profile.maxSpeedMps, 2)} m/s); positions here are not believable.`,
  });
}
