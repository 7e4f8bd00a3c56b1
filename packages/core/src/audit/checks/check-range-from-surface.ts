import type { AuditContext } from '../audit-context.js';
import { estimateSlantRanges } from '../estimate-slant-ranges.js';
import type { Finding } from '../finding.js';
import { findingsFromRuns, fixesDo, formatValue } from '../findings-from-runs.js';
import { measuredBuffer } from '../measured-buffer.js';

/**
 * Vehicle beyond acoustic or tether range: a fix whose slant range from the surface unit (logged,
 * or from the logged surface position and depth) exceeds `setup.maxRangeM` or the profile's
 * `maxRangeM`. Flags the fix; runs are `warn` findings (`fail` past `profile.flaggedShareFail`).
 * Silent when the log holds neither slant ranges nor surface positions.
 */
export function checkRangeFromSurface(context: AuditContext): Finding[] {
  const { n } = context;
  const limit = context.setup.maxRangeM ?? context.profile.maxRangeM;
  const ranges = estimateSlantRanges(context);
  const measured = measuredBuffer(context);
  for (let i = 0; i < n; i++) if ((ranges[i] as number) > limit) measured[i] = ranges[i] as number;
  return findingsFromRuns(context, 'out-of-reach', measured, {
    limit,
    unit: 'm',
    describe: (worst, count) =>
      `${fixesDo(count, 'puts', 'put')} the vehicle ${formatValue(worst, 0)} m from the surface unit, beyond the ${formatValue(limit, 0)} m acoustic or tether range.`,
  });
}
