import { createTransverseMercator } from './transverse-mercator.js';

/** WGS 84 ellipsoid constants (NIMA TR8350.2). */
const WGS84_A = 6378137;
const WGS84_F = 1 / 298.257223563;

/** A local east-north frame in metres around an origin, for plots, coverage and ENU arithmetic. */
export interface LocalFrame {
  readonly originLatDeg: number;
  readonly originLonDeg: number;
  /** Metres east and north of the origin. `NaN` in gives `NaN` out. */
  forward(latDeg: number, lonDeg: number): { eastM: number; northM: number };
  /** Back from metres east/north of the origin to WGS 84 degrees (longitude in [-180, 180)). */
  inverse(eastM: number, northM: number): { latDeg: number; lonDeg: number };
  /** Columnar `forward`, writing into the given arrays (allocated when omitted). */
  forwardColumns(
    latDeg: Float64Array,
    lonDeg: Float64Array,
    out?: { eastM: Float64Array; northM: Float64Array },
  ): { eastM: Float64Array; northM: Float64Array };
}

/**
 * Creates a local east-north-up frame in metres centred on a WGS 84 origin. It is a conformal
 * Transverse Mercator with scale 1 on the origin's meridian and the origin at (0, 0), so local
 * shapes and bearings are true and the scale error is below 1.3 ppm within 10 km of the origin's
 * meridian (x²/2R²). The "up" axis is minus the depth, left to the caller. Works across the
 * antimeridian. Throws `RangeError` for a non-finite origin.
 */
export function createLocalFrame(originLatDeg: number, originLonDeg: number): LocalFrame {
  if (!Number.isFinite(originLatDeg) || !Number.isFinite(originLonDeg) || Math.abs(originLatDeg) > 90)
    throw new RangeError(`local frame origin must be a finite WGS 84 position, got ${originLatDeg}, ${originLonDeg}`);
  const tm = createTransverseMercator({
    a: WGS84_A,
    f: WGS84_F,
    lat0Deg: originLatDeg,
    lon0Deg: originLonDeg,
    k0: 1,
    falseEastingM: 0,
    falseNorthingM: 0,
  });
  const scratch = new Float64Array(2);
  return {
    originLatDeg,
    originLonDeg,
    forward(latDeg, lonDeg) {
      if (Number.isNaN(latDeg) || Number.isNaN(lonDeg)) return { eastM: Number.NaN, northM: Number.NaN };
      tm.forwardPoint(latDeg, lonDeg, scratch);
      return { eastM: scratch[0] as number, northM: scratch[1] as number };
    },
    inverse(eastM, northM) {
      if (Number.isNaN(eastM) || Number.isNaN(northM)) return { latDeg: Number.NaN, lonDeg: Number.NaN };
      tm.inversePoint(eastM, northM, scratch);
      return { latDeg: scratch[0] as number, lonDeg: scratch[1] as number };
    },
    forwardColumns(latDeg, lonDeg, out) {
      const n = Math.min(latDeg.length, lonDeg.length);
      const target = out ?? { eastM: new Float64Array(n), northM: new Float64Array(n) };
      tm.forward(lonDeg, latDeg, target.eastM, target.northM);
      return target;
    },
  };
}
