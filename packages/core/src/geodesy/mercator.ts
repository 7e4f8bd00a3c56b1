/**
 * Mercator on an ellipsoid or a sphere (EPSG methods 9804 variant A, 9805 variant B, 1024
 * Popular Visualisation Pseudo-Mercator and 1026 spherical, which differ only in the ellipsoid and
 * scale given): y is the isometric latitude, asinh of the conformal latitude's tangent. Columnar
 * fast path of reprojection; checked against PROJ and the GN7-2 examples in the tests.
 */
import { normaliseLongitudeDeg, normaliseLongitudeRad } from '../model/units.js';
import { createConformalLatitude } from './conformal-latitude.js';

/** Parameters of one Mercator projection. */
export interface MercatorParams {
  /** Semi-major axis, metres. */
  a: number;
  /** Eccentricity squared (0 for a sphere). */
  e2: number;
  /** Central meridian, degrees. */
  lon0Deg: number;
  /** Scale on the equator (variant B: from the standard parallel). */
  k0: number;
  falseEastingM: number;
  falseNorthingM: number;
}

/** A ready Mercator projection on columns of degrees and metres. */
export interface Mercator {
  /** Projects columns; `NaN` in gives `NaN` out; the poles give infinite northings. */
  forward(lonDeg: Float64Array, latDeg: Float64Array, eastingM: Float64Array, northingM: Float64Array): void;
  /** Unprojects columns; `NaN` in gives `NaN` out. */
  inverse(eastingM: Float64Array, northingM: Float64Array, lonDeg: Float64Array, latDeg: Float64Array): void;
}

const DEG = Math.PI / 180;

/** Builds a Mercator projection. */
export function createMercator(params: MercatorParams): Mercator {
  const { a, k0, falseEastingM, falseNorthingM } = params;
  const { conformalTan, geodeticLatitude } = createConformalLatitude(params.e2);
  const scale = a * k0;
  const lon0 = params.lon0Deg * DEG;
  return {
    forward(lonDeg, latDeg, eastingM, northingM) {
      const n = Math.min(lonDeg.length, latDeg.length);
      for (let i = 0; i < n; i++) {
        const dLon = normaliseLongitudeRad((lonDeg[i] as number) * DEG - lon0);
        const lat = latDeg[i] as number;
        eastingM[i] = falseEastingM + scale * dLon;
        // tan(±90°) is finite in floating point; the poles are outside Mercator's domain.
        northingM[i] =
          Math.abs(lat) >= 90
            ? Math.sign(lat) * Number.POSITIVE_INFINITY
            : falseNorthingM + scale * Math.asinh(conformalTan(Math.tan(lat * DEG)));
      }
    },
    inverse(eastingM, northingM, lonDeg, latDeg) {
      const n = Math.min(eastingM.length, northingM.length);
      for (let i = 0; i < n; i++) {
        const psi = ((northingM[i] as number) - falseNorthingM) / scale;
        latDeg[i] = geodeticLatitude(Math.sinh(psi)) / DEG;
        lonDeg[i] = normaliseLongitudeDeg((lon0 + ((eastingM[i] as number) - falseEastingM) / scale) / DEG);
      }
    },
  };
}
