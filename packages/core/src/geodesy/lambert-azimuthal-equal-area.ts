/**
 * Lambert Azimuthal Equal Area, oblique and equatorial aspects, on an ellipsoid or a sphere (EPSG
 * method 9820, IOGP Guidance Note 7-2 §3.3.3), through the authalic latitude β. The inverse starts
 * from the guidance note's series for φ(β′), good to millimetres, and polishes it with Newton's
 * method on q(φ) (Snyder 1987, eq. 3-16), which leaves micrometre-level errors nowhere.
 * Polar aspects are not handled here (reprojection leaves them to proj4). Columnar fast path of
 * reprojection; checked against PROJ in the tests.
 */
import { normaliseLongitudeDeg, normaliseLongitudeRad } from '../model/units.js';
import type { ColumnarProjection } from './columnar-projection.js';

/** Parameters of one Lambert Azimuthal Equal Area projection, as PROJ's `+proj=laea` gives them. */
export interface LambertAzimuthalEqualAreaParams {
  /** Semi-major axis, metres. */
  a: number;
  /** Eccentricity squared (0 for a sphere). */
  e2: number;
  /** Latitude of the natural origin, degrees (strictly between −90 and 90). */
  lat0Deg: number;
  lon0Deg: number;
  falseEastingM: number;
  falseNorthingM: number;
}

const DEG = Math.PI / 180;

/** Builds a Lambert Azimuthal Equal Area projection; throws for a polar origin (|lat0| = 90°). */
export function createLambertAzimuthalEqualArea(params: LambertAzimuthalEqualAreaParams): ColumnarProjection {
  const { a, e2, falseEastingM, falseNorthingM } = params;
  if (!(Math.abs(params.lat0Deg) < 90)) throw new RangeError('The polar aspect needs its own formulas.');
  const e = Math.sqrt(e2);
  const oneMinusE2 = 1 - e2;
  // q(φ) of GN7-2; on a sphere q = 2 sin φ.
  const q = (sinPhi: number): number =>
    e === 0
      ? 2 * sinPhi
      : oneMinusE2 *
        (sinPhi / (1 - e2 * sinPhi * sinPhi) - (1 / (2 * e)) * Math.log((1 - e * sinPhi) / (1 + e * sinPhi)));
  const qP = q(1);
  const rq = a * Math.sqrt(qP / 2);
  const phi0 = params.lat0Deg * DEG;
  const sinPhi0 = Math.sin(phi0);
  const beta0 = Math.asin(q(sinPhi0) / qP);
  const sinB0 = Math.sin(beta0);
  const cosB0 = Math.cos(beta0);
  const d = (a * Math.cos(phi0)) / Math.sqrt(1 - e2 * sinPhi0 * sinPhi0) / (rq * cosB0);
  const lon0 = params.lon0Deg * DEG;
  const e4 = e2 * e2;
  const e6 = e4 * e2;
  const c2 = e2 / 3 + (31 * e4) / 180 + (517 * e6) / 5040;
  const c4 = (23 * e4) / 360 + (251 * e6) / 3780;
  const c6 = (761 * e6) / 45360;
  return {
    forward(lonDeg, latDeg, eastingM, northingM) {
      const count = Math.min(lonDeg.length, latDeg.length);
      for (let i = 0; i < count; i++) {
        const dLon = normaliseLongitudeRad((lonDeg[i] as number) * DEG - lon0);
        const sinB = Math.max(-1, Math.min(1, q(Math.sin((latDeg[i] as number) * DEG)) / qP));
        const cosB = Math.sqrt(1 - sinB * sinB);
        const cosDLon = Math.cos(dLon);
        const denominator = 1 + sinB0 * sinB + cosB0 * cosB * cosDLon;
        // The antipode of the origin (denominator 0) is outside the domain: infinite, then NaN.
        const b = rq * Math.sqrt(2 / denominator);
        eastingM[i] = falseEastingM + b * d * cosB * Math.sin(dLon);
        northingM[i] = falseNorthingM + (b / d) * (cosB0 * sinB - sinB0 * cosB * cosDLon);
      }
    },
    inverse(eastingM, northingM, lonDeg, latDeg) {
      const count = Math.min(eastingM.length, northingM.length);
      for (let i = 0; i < count; i++) {
        const x = ((eastingM[i] as number) - falseEastingM) / d;
        const y = ((northingM[i] as number) - falseNorthingM) * d;
        const rho = Math.hypot(x, y);
        if (rho === 0) {
          latDeg[i] = params.lat0Deg;
          lonDeg[i] = params.lon0Deg;
          continue;
        }
        const ce = 2 * Math.asin(rho / (2 * rq));
        const sinC = Math.sin(ce);
        const cosC = Math.cos(ce);
        const sinBeta = cosC * sinB0 + (y * sinC * cosB0) / rho;
        const beta = Math.asin(sinBeta);
        let phi = beta + c2 * Math.sin(2 * beta) + c4 * Math.sin(4 * beta) + c6 * Math.sin(6 * beta);
        if (e !== 0 && Math.abs(phi) < Math.PI / 2 - 1e-9) {
          const target = qP * sinBeta;
          for (let k = 0; k < 2; k++) {
            const s = Math.sin(phi);
            const w = 1 - e2 * s * s;
            phi += ((w * w) / (2 * Math.cos(phi))) * ((target - q(s)) / oneMinusE2);
          }
        }
        latDeg[i] = phi / DEG;
        lonDeg[i] = normaliseLongitudeDeg((lon0 + Math.atan2(x * sinC, rho * cosB0 * cosC - y * sinB0 * sinC)) / DEG);
      }
    },
  };
}
