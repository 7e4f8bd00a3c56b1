import type { AuditContext } from '../audit-context.js';
import type { Finding } from '../finding.js';
import { findingsFromRuns, fixCount } from '../findings-from-runs.js';
import { measuredBuffer } from '../measured-buffer.js';

/**
 * Impossible coordinates: a fix without a position, outside latitude ±90° or longitude ±180°, or
 * at 0°, 0° (the placeholder many loggers write when they have no fix). Flags the fix; runs are
 * `warn` findings (`fail` past `profile.flaggedShareFail`). Measured is the fix's distance in
 * degrees from 0,0 (`NaN` when missing).
 */
export function checkImpossiblePositions(context: AuditContext): Finding[] {
  const { n, plausible } = context;
  const { latDeg, lonDeg } = context.track.columns;
  const measured = measuredBuffer(context);
  for (let i = 0; i < n; i++) {
    if (plausible[i] === 1) continue;
    const lat = latDeg[i] as number;
    const lon = lonDeg[i] as number;
    const size = Math.hypot(lat, lon);
    measured[i] = Number.isNaN(size) ? -1 : size;
  }
  const findings = findingsFromRuns(context, 'impossible-position', measured, {
    limit: Number.NaN,
    unit: 'deg',
    describe: (_worst, count) =>
      `${fixCount(count)} at an impossible position (missing, out of range, or at 0°, 0°); not a real place.`,
  });
  for (const finding of findings) if (finding.measured < 0) finding.measured = Number.NaN;
  return findings;
}
