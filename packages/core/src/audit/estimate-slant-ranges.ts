import type { AuditContext } from './audit-context.js';

/**
 * Slant range from the transceiver to the vehicle for each fix, metres: the logged slant range
 * when there is one, else the 3-D distance from the logged surface unit position (at the
 * transceiver draft, 0 when unknown) to the vehicle fix; `NaN` when neither is known. Computed
 * once per audit (kept in `context.cache`).
 */
export function estimateSlantRanges(context: AuditContext): Float64Array {
  if (context.cache.slantRangesM !== undefined) return context.cache.slantRangesM;
  const { n, eastM, northM, surfaceEastM, surfaceNorthM } = context;
  const { slantRangeM, depthM } = context.track.columns;
  const draftM = context.setup.transceiverDraftM ?? 0;
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const logged = slantRangeM[i] as number;
    if (logged >= 0) {
      out[i] = logged;
      continue;
    }
    const de = (eastM[i] as number) - (surfaceEastM[i] as number);
    const dn = (northM[i] as number) - (surfaceNorthM[i] as number);
    const depth = depthM[i] as number;
    const dz = Number.isNaN(depth) ? 0 : depth - draftM;
    out[i] = Math.sqrt(de * de + dn * dn + dz * dz);
  }
  context.cache.slantRangesM = out;
  return out;
}

/**
 * Horizontal distance from the transceiver to the vehicle, metres: from the logged surface unit
 * position when there is one, else from slant range and the depth below the transceiver.
 */
export function estimateHorizontalOffsets(context: AuditContext, slantRangesM: Float64Array): Float64Array {
  const { n, eastM, northM, surfaceEastM, surfaceNorthM } = context;
  const { depthM } = context.track.columns;
  const draftM = context.setup.transceiverDraftM ?? 0;
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const de = (eastM[i] as number) - (surfaceEastM[i] as number);
    const dn = (northM[i] as number) - (surfaceNorthM[i] as number);
    const fromPositions = Math.sqrt(de * de + dn * dn);
    if (!Number.isNaN(fromPositions)) {
      out[i] = fromPositions;
      continue;
    }
    const range = slantRangesM[i] as number;
    const depth = depthM[i] as number;
    const dz = Number.isNaN(depth) ? 0 : depth - draftM;
    out[i] = Math.sqrt(Math.max(0, range * range - dz * dz));
  }
  return out;
}
