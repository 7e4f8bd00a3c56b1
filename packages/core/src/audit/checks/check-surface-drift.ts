import type { AuditContext } from '../audit-context.js';
import type { Finding } from '../finding.js';
import { formatValue } from '../findings-from-runs.js';

function median(values: number[]): number {
  values.sort((a, b) => a - b);
  const mid = values.length >> 1;
  return values.length % 2 === 1
    ? (values[mid] as number)
    : ((values[mid - 1] as number) + (values[mid] as number)) / 2;
}

/**
 * Surface unit drifting while the setup says it is stationary: each surface position is compared
 * with where the unit was set up (its median position over the log's first `profile.fixRateWindowS`
 * seconds); runs farther than `surfaceDriftWarnM` are findings, `fail` when they reach
 * `surfaceDriftFailM` (the setup's values when given, else the profile's). No fix is flagged (the vehicle positions
 * follow the real surface position; a re-solve from a fixed surveyed position would not). An
 * `info` finding when the setup says stationary but the log has no surface positions.
 */
export function checkSurfaceDrift(context: AuditContext): Finding[] {
  const { n, setup, surfaceEastM, surfaceNorthM, hasSurface } = context;
  const profile = {
    ...context.profile,
    surfaceDriftWarnM: setup.surfaceDriftWarnM ?? context.profile.surfaceDriftWarnM,
    surfaceDriftFailM: setup.surfaceDriftFailM ?? context.profile.surfaceDriftFailM,
  };
  const time = context.track.columns.timeMs;
  if (setup.surfaceStationary !== true || n === 0) return [];
  if (!hasSurface) {
    return [
      {
        check: 'surface-drift',
        severity: 'info',
        startIndex: 0,
        endIndex: n - 1,
        startTimeMs: time[0] as number,
        endTimeMs: time[n - 1] as number,
        measured: Number.NaN,
        limit: profile.surfaceDriftWarnM,
        unit: 'm',
        message: 'The setup says the surface unit was stationary, but the log has no surface positions to confirm it.',
      },
    ];
  }
  // where it was set up: the median surface position over the first `fixRateWindowS` of the log
  const east: number[] = [];
  const north: number[] = [];
  const setupEndMs = (time[0] as number) + profile.fixRateWindowS * 1000;
  for (let i = 0; i < n && (east.length < 3 || (time[i] as number) <= setupEndMs); i++) {
    const e = surfaceEastM[i] as number;
    if (Number.isNaN(e)) continue;
    east.push(e);
    north.push(surfaceNorthM[i] as number);
  }
  const e0 = median(east);
  const n0 = median(north);
  const findings: Finding[] = [];
  let open: Finding | undefined;
  for (let i = 0; i < n; i++) {
    const d = Math.hypot((surfaceEastM[i] as number) - e0, (surfaceNorthM[i] as number) - n0);
    if (d > profile.surfaceDriftWarnM) {
      if (open === undefined) {
        open = {
          check: 'surface-drift',
          severity: 'warn',
          startIndex: i,
          endIndex: i,
          startTimeMs: time[i] as number,
          endTimeMs: time[i] as number,
          measured: d,
          limit: profile.surfaceDriftWarnM,
          unit: 'm',
          message: '',
        };
        findings.push(open);
      }
      open.endIndex = i;
      open.endTimeMs = time[i] as number;
      if (d > open.measured) open.measured = d;
    } else if (!Number.isNaN(d)) open = undefined;
  }
  for (const finding of findings) {
    if (finding.measured >= profile.surfaceDriftFailM) {
      finding.severity = 'fail';
      finding.limit = profile.surfaceDriftFailM;
    }
    finding.message = `The surface unit, meant to be stationary, moved up to ${formatValue(finding.measured)} m from where it was set up (limit ${formatValue(finding.limit)} m).`;
  }
  return findings;
}
