/**
 * Lambert Conic Conformal on an ellipsoid or a sphere (EPSG methods 9801 one standard parallel and
 * 9802 two standard parallels, IOGP Guidance Note 7-2 §3.2.1): the radius on the cone is
 * a·F·k0·e^(−n·ψ), with ψ the isometric latitude, computed through the conformal latitude shared
 * with the Mercator projections. Columnar fast path of reprojection; checked against the GN7-2
 * example and PROJ in the tests.
 */
import { normaliseLongitudeDeg, normaliseLongitudeRad } from '../model/units.js';
import type { ColumnarProjection } from './columnar-projection.js';
import { createConformalLatitude } from './conformal-latitude.js';

/** Parameters of one Lambert Conic Conformal projection, as PROJ's `+proj=lcc` gives them. */
export interface LambertConformalConicParams {
  /** Semi-major axis, metres. */
  a: number;
  /** Eccentricity squared (0 for a sphere). */
  e2: number;
  /** Latitude of the false origin (2SP) or natural origin (1SP), degrees. */
  lat0Deg: number;
  /** Central meridian, degrees. */
  lon0Deg: number;
  /** First standard parallel, degrees (1SP: the origin's latitude). */
  lat1Deg: number;
  /** Second standard parallel, degrees (1SP: equal to the first). */
  lat2Deg: number;
  /** Scale factor on the standard parallel of a 1SP projection; 1 for 2SP. */
  k0: number;
  falseEastingM: number;
  falseNorthingM: number;
}

const DEG = Math.PI / 180;

/**
 * Builds a Lambert Conic Conformal projection. Throws for parallels that give no cone (opposite
 * standard parallels, or a standard parallel on the equator), which proj4 rejects too.
 */
export function createLambertConformalConic(params: LambertConformalConicParams): ColumnarProjection {
  const { a, e2, k0, falseEastingM, falseNorthingM } = params;
  const { conformalTan, geodeticLatitude } = createConformalLatitude(e2);
  const isometric = (latDeg: number) => Math.asinh(conformalTan(Math.tan(latDeg * DEG)));
  const m = (latDeg: number) => {
    const s = Math.sin(latDeg * DEG);
    return Math.cos(latDeg * DEG) / Math.sqrt(1 - e2 * s * s);
  };
  const psi1 = isometric(params.lat1Deg);
  const psi2 = isometric(params.lat2Deg);
  // n = (ln m1 − ln m2)/(ln t1 − ln t2) with ln t = −ψ; one parallel: n = sin φ1.
  const n =
    Math.abs(params.lat1Deg - params.lat2Deg) < 1e-12
      ? Math.sin(params.lat1Deg * DEG)
      : (Math.log(m(params.lat1Deg)) - Math.log(m(params.lat2Deg))) / (psi2 - psi1);
  if (!Number.isFinite(n) || Math.abs(n) < 1e-12) throw new RangeError('These standard parallels define no cone.');
  // r = a·F·k0·t^n with t = e^(−ψ) and F = m1/(n·t1^n).
  const aFk0 = (a * k0 * m(params.lat1Deg) * Math.exp(n * psi1)) / n;
  const rF = aFk0 * Math.exp(-n * isometric(params.lat0Deg));
  const lon0 = params.lon0Deg * DEG;
  const sign = n < 0 ? -1 : 1;
  return {
    forward(lonDeg, latDeg, eastingM, northingM) {
      const count = Math.min(lonDeg.length, latDeg.length);
      for (let i = 0; i < count; i++) {
        const lat = latDeg[i] as number;
        const theta = n * normaliseLongitudeRad((lonDeg[i] as number) * DEG - lon0);
        // The pole at the cone's apex maps to its tip (r = 0); the other pole is outside the domain.
        const r =
          Math.abs(lat) >= 90
            ? lat * n > 0
              ? 0
              : Number.POSITIVE_INFINITY
            : aFk0 * Math.exp(-n * Math.asinh(conformalTan(Math.tan(lat * DEG))));
        eastingM[i] = falseEastingM + r * Math.sin(theta);
        northingM[i] = falseNorthingM + rF - r * Math.cos(theta);
      }
    },
    inverse(eastingM, northingM, lonDeg, latDeg) {
      const count = Math.min(eastingM.length, northingM.length);
      for (let i = 0; i < count; i++) {
        const dx = (eastingM[i] as number) - falseEastingM;
        const dy = rF - ((northingM[i] as number) - falseNorthingM);
        const r = sign * Math.hypot(dx, dy);
        const theta = Math.atan2(sign * dx, sign * dy);
        // ψ = −ln(t′) with t′ = (r/(a·F·k0))^(1/n).
        const psi = -Math.log(r / aFk0) / n;
        latDeg[i] = r === 0 ? sign * 90 : geodeticLatitude(Math.sinh(psi)) / DEG;
        lonDeg[i] = normaliseLongitudeDeg((theta / n + lon0) / DEG);
      }
    },
  };
}
