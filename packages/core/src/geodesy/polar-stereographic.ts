/**
 * Polar Stereographic on an ellipsoid or a sphere (EPSG methods 9810 variant A, scale at the pole,
 * and 9829 variant B, a standard parallel; IOGP Guidance Note 7-2 §3.5.2): ρ = 2·a·k0·t/√((1+e)^(1+e)(1−e)^(1−e))
 * with t = e^(−ψ) of the isometric latitude ψ, through the shared conformal latitude. Columnar fast
 * path of reprojection; checked against the GN7-2 example and PROJ in the tests.
 */
import { normaliseLongitudeDeg, normaliseLongitudeRad } from '../model/units.js';
import type { ColumnarProjection } from './columnar-projection.js';
import { createConformalLatitude } from './conformal-latitude.js';

/** Parameters of one polar stereographic projection, as PROJ's `+proj=stere +lat_0=±90` gives them. */
export interface PolarStereographicParams {
  /** Semi-major axis, metres. */
  a: number;
  /** Eccentricity squared (0 for a sphere). */
  e2: number;
  /** The pole at the centre: `north` (+lat_0=90) or `south` (−90). */
  pole: 'north' | 'south';
  /** Meridian pointing down from the north pole (up from the south pole) on the map, degrees. */
  lon0Deg: number;
  /** Variant A: scale at the pole. Ignored when `latTsDeg` is given. */
  k0: number;
  /** Variant B: latitude of true scale, degrees (same hemisphere as the pole). */
  latTsDeg?: number;
  falseEastingM: number;
  falseNorthingM: number;
}

const DEG = Math.PI / 180;

/** Builds a polar stereographic projection (variant A from `k0`, variant B from `latTsDeg`). */
export function createPolarStereographic(params: PolarStereographicParams): ColumnarProjection {
  const { a, e2, falseEastingM, falseNorthingM } = params;
  const e = Math.sqrt(e2);
  const { conformalTan, geodeticLatitude } = createConformalLatitude(e2);
  // The south pole's projection is the north pole's applied to −φ, with the northing axis flipped.
  const south = params.pole === 'south' ? -1 : 1;
  const c = Math.sqrt((1 + e) ** (1 + e) * (1 - e) ** (1 - e));
  let k0 = params.k0;
  if (params.latTsDeg !== undefined && Math.abs(Math.abs(params.latTsDeg) - 90) > 1e-12) {
    const phiF = south * params.latTsDeg * DEG;
    const s = Math.sin(phiF);
    const mF = Math.cos(phiF) / Math.sqrt(1 - e2 * s * s);
    const tF = Math.exp(-Math.asinh(conformalTan(Math.tan(phiF))));
    k0 = (mF * c) / (2 * tF);
  }
  const scale = (2 * a * k0) / c;
  const lon0 = params.lon0Deg * DEG;
  return {
    forward(lonDeg, latDeg, eastingM, northingM) {
      const count = Math.min(lonDeg.length, latDeg.length);
      for (let i = 0; i < count; i++) {
        const lat = south * (latDeg[i] as number);
        const dLon = normaliseLongitudeRad((lonDeg[i] as number) * DEG - lon0);
        const rho =
          lat >= 90
            ? 0
            : lat <= -90
              ? Number.POSITIVE_INFINITY
              : scale * Math.exp(-Math.asinh(conformalTan(Math.tan(lat * DEG))));
        eastingM[i] = falseEastingM + rho * Math.sin(dLon);
        northingM[i] = falseNorthingM - south * rho * Math.cos(dLon);
      }
    },
    inverse(eastingM, northingM, lonDeg, latDeg) {
      const count = Math.min(eastingM.length, northingM.length);
      for (let i = 0; i < count; i++) {
        const dx = (eastingM[i] as number) - falseEastingM;
        const dy = (northingM[i] as number) - falseNorthingM;
        const rho = Math.hypot(dx, dy);
        const psi = -Math.log(rho / scale);
        latDeg[i] = rho === 0 ? south * 90 : south * (geodeticLatitude(Math.sinh(psi)) / DEG);
        lonDeg[i] = normaliseLongitudeDeg((lon0 + Math.atan2(dx, -south * dy)) / DEG);
      }
    },
  };
}
