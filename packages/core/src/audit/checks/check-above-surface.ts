import type { AuditContext } from '../audit-context.js';
import type { Finding } from '../finding.js';
import { findingsFromRuns, fixesDo, formatValue } from '../findings-from-runs.js';
import { measuredBuffer } from '../measured-buffer.js';
import { shareAboveSurface } from './check-depth-sign.js';

/**
 * Vehicle track above the water surface: a depth shallower than minus
 * `profile.aboveSurfaceToleranceM`. Flags the fix; runs are `warn` findings (`fail` past
 * `profile.flaggedShareFail`). Silent when most depths are above the water, which the depth-sign
 * check reports as one problem instead of flagging every fix.
 */
export function checkAboveSurface(context: AuditContext): Finding[] {
  const { n, profile } = context;
  if (shareAboveSurface(context) > 0.5) return [];
  const depth = context.track.columns.depthM;
  const measured = measuredBuffer(context);
  for (let i = 0; i < n; i++) {
    const d = depth[i] as number;
    if (d < -profile.aboveSurfaceToleranceM) measured[i] = -d;
  }
  return findingsFromRuns(context, 'above-surface', measured, {
    limit: profile.aboveSurfaceToleranceM,
    unit: 'm',
    describe: (worst, count) =>
      `${fixesDo(count, 'puts', 'put')} the vehicle up to ${formatValue(worst)} m above the water surface; a depth offset or sensor fault.`,
  });
}
