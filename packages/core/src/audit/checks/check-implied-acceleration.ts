import type { AuditContext } from '../audit-context.js';
import type { Finding } from '../finding.js';
import { findingsFromRuns, formatValue } from '../findings-from-runs.js';
import { measuredBuffer } from '../measured-buffer.js';
import { findBaselinePartners } from './check-implied-speed.js';

/**
 * Implied acceleration beyond the platform's limit: the change of velocity between two
 * consecutive legs of half `profile.speedBaselineS` of robust local positions, divided by the time between
 * the legs' midpoints. Runs above `profile.maxAccelerationMps2` are `warn` findings; no fix is flagged.
 */
export function checkImpliedAcceleration(context: AuditContext): Finding[] {
  const { n, profile, medianEastM, medianNorthM } = context;
  const time = context.track.columns.timeMs;
  const partner = findBaselinePartners(context, profile.speedBaselineS / 2);
  const measured = measuredBuffer(context);
  const spanEnd = new Int32Array(n).fill(-1);
  for (let i = 0; i < n; i++) {
    const j = partner[i] as number;
    if (j < 0) continue;
    const k = partner[j] as number;
    if (k < 0) continue;
    const ti = time[i] as number;
    const tj = time[j] as number;
    const tk = time[k] as number;
    const dt1 = (tj - ti) / 1000;
    const dt2 = (tk - tj) / 1000;
    const ve1 = ((medianEastM[j] as number) - (medianEastM[i] as number)) / dt1;
    const vn1 = ((medianNorthM[j] as number) - (medianNorthM[i] as number)) / dt1;
    const ve2 = ((medianEastM[k] as number) - (medianEastM[j] as number)) / dt2;
    const vn2 = ((medianNorthM[k] as number) - (medianNorthM[j] as number)) / dt2;
    const dv = Math.sqrt((ve2 - ve1) ** 2 + (vn2 - vn1) ** 2);
    const acceleration = dv / ((dt1 + dt2) / 2);
    if (acceleration > profile.maxAccelerationMps2) {
      measured[i] = acceleration;
      spanEnd[i] = k;
    }
  }
  return findingsFromRuns(context, 'too-sudden', measured, {
    limit: profile.maxAccelerationMps2,
    unit: 'm/s²',
    flag: false,
    spanEnd,
    severity: 'warn',
    describe: (worst) =>
      `The track implies an acceleration of ${formatValue(worst, 2)} m/s², more than this platform manages (${formatValue(profile.maxAccelerationMps2, 2)} m/s²).`,
  });
}
