import type { AuditContext } from '../audit-context.js';
import type { Finding } from '../finding.js';
import { formatValue } from '../findings-from-runs.js';

/** Share of fixes with a depth more than the tolerance above the water; `NaN` when no fix has a depth. */
export function shareAboveSurface(context: AuditContext): number {
  const depth = context.track.columns.depthM;
  const tolerance = context.profile.aboveSurfaceToleranceM;
  let known = 0;
  let above = 0;
  for (let i = 0; i < context.n; i++) {
    const d = depth[i] as number;
    if (Number.isNaN(d)) continue;
    known++;
    if (d < -tolerance) above++;
  }
  return known === 0 ? Number.NaN : above / known;
}

/**
 * Depth-versus-elevation sign doubtful: a `fail` when most depths lie above the water (the log
 * probably gave elevation, read as depth, or the reverse), and a `warn` when the reader itself
 * marked its depth-sign decision as doubtful. Spans the whole log; flags nothing.
 */
export function checkDepthSign(context: AuditContext): Finding[] {
  const { n, track } = context;
  if (n === 0) return [];
  const time = track.columns.timeMs;
  const base = {
    check: 'depth-sign-doubtful' as const,
    startIndex: 0,
    endIndex: n - 1,
    startTimeMs: time[0] as number,
    endTimeMs: time[n - 1] as number,
    unit: 'share',
  };
  const findings: Finding[] = [];
  const share = shareAboveSurface(context);
  if (share > 0.5)
    findings.push({
      ...base,
      severity: 'fail',
      measured: share,
      limit: 0.5,
      message: `${formatValue(share * 100, 0)} % of the depths are above the water: the vertical values are probably elevations read as depths (or the reverse).`,
    });
  const decision = track.provenance.depthSign;
  if (decision.doubtful)
    findings.push({
      ...base,
      severity: 'warn',
      measured: Number.NaN,
      limit: Number.NaN,
      message: `The reader's depth-sign decision (${decision.rule}) is doubtful: ${decision.reason}`,
    });
  return findings;
}
