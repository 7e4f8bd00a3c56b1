import type { Track } from '../model/track.js';
import type { AuditProfile } from './audit-profile.js';
import type { AuditSetup } from './audit-setup.js';
import { createTangentPlane, type TangentPlane } from './create-tangent-plane.js';
import type { CheckName } from './finding.js';
import { neighbourMedian } from './robust-window.js';

/** Half-width, in fixes, of the neighbour windows the robust checks use (8 neighbours). */
export const NEIGHBOUR_HALF_WIDTH = 4;
/**
 * Half-width, in fixes, of the window whose median residual is the local spread: 32 neighbours
 * give a scale steady enough to multiply by the spread factor (8 alone wander by tens of per cent).
 */
export const SPREAD_HALF_WIDTH = 16;

/** The bit each fix-flagging check sets in `AuditContext.flags`. */
export const FLAG_BITS: Partial<Record<CheckName, number>> = {
  'time-backwards': 1,
  'repeated-time': 2,
  'impossible-position': 4,
  'position-jump': 8,
  'depth-jump': 16,
  'out-of-reach': 32,
  'above-surface': 64,
};

/** Everything the checks share, computed once per audit: projected positions and robust local statistics. */
export interface AuditContext {
  track: Track;
  profile: AuditProfile;
  setup: AuditSetup;
  n: number;
  /** The local frame positions are projected into (origin: the first plausible fix); undefined when none is plausible. */
  frame: TangentPlane | undefined;
  /** 1 where the fix has a plausible WGS 84 position (finite, in range, not 0,0). */
  plausible: Uint8Array;
  eastM: Float64Array;
  northM: Float64Array;
  /** Median of the neighbours' east/north (fix itself left out): a robust local position. */
  medianEastM: Float64Array;
  medianNorthM: Float64Array;
  /** Distance of each fix from its neighbours' median, metres. */
  residualM: Float64Array;
  /** The surface unit's position in the same frame, `NaN` where the log has none. */
  surfaceEastM: Float64Array;
  surfaceNorthM: Float64Array;
  /** Whether any fix carries a surface unit position. */
  hasSurface: boolean;
  /** Per-fix bit set of the checks that flagged the fix (see `FLAG_BITS`). */
  flags: Uint16Array;
  /** Values several checks need, computed by the first that asks. */
  cache: { slantRangesM?: Float64Array; measured?: Float64Array };
}

/** Whether a WGS 84 position could be real: finite, in range and not the 0,0 placeholder many loggers write. */
export function isPlausiblePosition(latDeg: number, lonDeg: number): boolean {
  if (!(latDeg >= -90 && latDeg <= 90 && lonDeg >= -180 && lonDeg <= 180)) return false;
  return !(Math.abs(latDeg) < 1e-9 && Math.abs(lonDeg) < 1e-9);
}

/** Projects a track and computes the shared robust statistics. */
export function createAuditContext(track: Track, profile: AuditProfile, setup: AuditSetup): AuditContext {
  const n = track.length;
  const { latDeg, lonDeg } = track.columns;
  const plausible = new Uint8Array(n);
  let origin = -1;
  for (let i = 0; i < n; i++) {
    if (isPlausiblePosition(latDeg[i] as number, lonDeg[i] as number)) {
      plausible[i] = 1;
      if (origin < 0) origin = i;
    }
  }
  const eastM = new Float64Array(n).fill(Number.NaN);
  const northM = new Float64Array(n).fill(Number.NaN);
  let frame: TangentPlane | undefined;
  if (origin >= 0) {
    frame = createTangentPlane(latDeg[origin] as number, lonDeg[origin] as number);
    frame.forwardColumns(latDeg, lonDeg, eastM, northM);
    for (let i = 0; i < n; i++) {
      if (plausible[i] === 0) {
        eastM[i] = Number.NaN;
        northM[i] = Number.NaN;
      }
    }
  }
  const surfaceEastM = new Float64Array(n).fill(Number.NaN);
  const surfaceNorthM = new Float64Array(n).fill(Number.NaN);
  const { surfaceLatDeg, surfaceLonDeg } = track.columns;
  let hasSurface = false;
  if (frame !== undefined) {
    frame.forwardColumns(surfaceLatDeg, surfaceLonDeg, surfaceEastM, surfaceNorthM);
    for (let i = 0; i < n; i++) {
      if (isPlausiblePosition(surfaceLatDeg[i] as number, surfaceLonDeg[i] as number)) hasSurface = true;
      else {
        surfaceEastM[i] = Number.NaN;
        surfaceNorthM[i] = Number.NaN;
      }
    }
  }
  const medianEastM = neighbourMedian(eastM, NEIGHBOUR_HALF_WIDTH, new Float64Array(n));
  const medianNorthM = neighbourMedian(northM, NEIGHBOUR_HALF_WIDTH, new Float64Array(n));
  const residualM = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const de = (eastM[i] as number) - (medianEastM[i] as number);
    const dn = (northM[i] as number) - (medianNorthM[i] as number);
    residualM[i] = Math.sqrt(de * de + dn * dn);
  }
  return {
    track,
    profile,
    setup,
    n,
    frame,
    plausible,
    eastM,
    northM,
    medianEastM,
    medianNorthM,
    residualM,
    surfaceEastM,
    surfaceNorthM,
    hasSurface,
    flags: new Uint16Array(n),
    cache: {},
  };
}
