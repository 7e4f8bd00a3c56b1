/**
 * A 3- or 7-parameter (position vector, PROJ `+towgs84`) datum shift between WGS 84 and another
 * geodetic datum, through geocentric coordinates at zero height: proj4's small-angle formulas
 * towards the datum and their exact inverse back, agreeing with PROJ to under 1 mm (checked in
 * create-reprojection.test.ts).
 */

/** Parameters as proj4 holds them: metres, radians, and the scale as a factor (1 + ppm·1e-6). */
export interface HelmertParams {
  dx: number;
  dy: number;
  dz: number;
  rx: number;
  ry: number;
  rz: number;
  scale: number;
}

/** Shifts latitude/longitude (degrees) between WGS 84 and the datum; writes lat, lon, height (m) into out[0..2]. */
export interface HelmertShift {
  toDatum(latDeg: number, lonDeg: number, out: Float64Array): void;
  toWgs84(latDeg: number, lonDeg: number, out: Float64Array): void;
}

const DEG = Math.PI / 180;
const WGS84_A = 6378137;
const WGS84_E2 = (1 / 298.257223563) * (2 - 1 / 298.257223563);

function toGeocentric(latDeg: number, lonDeg: number, a: number, e2: number, out: Float64Array, heightM = 0): void {
  const lat = latDeg * DEG;
  const lon = lonDeg * DEG;
  const s = Math.sin(lat);
  const c = Math.cos(lat);
  const n = a / Math.sqrt(1 - e2 * s * s);
  out[0] = (n + heightM) * c * Math.cos(lon);
  out[1] = (n + heightM) * c * Math.sin(lon);
  out[2] = (n * (1 - e2) + heightM) * s;
}

// Iterating latitude with the height implied by the last estimate: a few steps reach micrometres
// for points near the ellipsoid, which is all a datum shift at zero height produces.
function toGeodetic(x: number, y: number, z: number, a: number, e2: number, out: Float64Array): void {
  const p = Math.hypot(x, y);
  let lat = Math.atan2(z, p * (1 - e2));
  let h = 0;
  for (let i = 0; i < 3; i++) {
    const s = Math.sin(lat);
    const n = a / Math.sqrt(1 - e2 * s * s);
    h = Math.abs(lat) < 1.5 ? p / Math.cos(lat) - n : z / s - n * (1 - e2);
    lat = Math.atan2(z, p * (1 - (e2 * n) / (n + h)));
  }
  out[0] = lat / DEG;
  out[1] = Math.atan2(y, x) / DEG;
  out[2] = h;
}

/** Builds the shift between WGS 84 and a datum on the ellipsoid (`a` metres, `e2` eccentricity²). */
export function createHelmertShift(params: HelmertParams, a: number, e2: number): HelmertShift {
  const { dx, dy, dz, rx, ry, rz, scale } = params;
  const g = new Float64Array(3);
  // WGS 84 → datum exactly as proj4's geocentricFromWgs84 (translation, 1/scale, the transposed
  // small-angle rotation), which agrees with PROJ to 0.75 mm over Great Britain; datum → WGS 84 is
  // the exact inverse of that map, so the two directions are consistent with each other.
  const m = [
    [1 / scale, rz / scale, -ry / scale],
    [-rz / scale, 1 / scale, rx / scale],
    [ry / scale, -rx / scale, 1 / scale],
  ] as const;
  const det =
    m[0][0] * (m[1][1] * m[2][2] - m[1][2] * m[2][1]) -
    m[0][1] * (m[1][0] * m[2][2] - m[1][2] * m[2][0]) +
    m[0][2] * (m[1][0] * m[2][1] - m[1][1] * m[2][0]);
  const inv = [
    [
      (m[1][1] * m[2][2] - m[1][2] * m[2][1]) / det,
      (m[0][2] * m[2][1] - m[0][1] * m[2][2]) / det,
      (m[0][1] * m[1][2] - m[0][2] * m[1][1]) / det,
    ],
    [
      (m[1][2] * m[2][0] - m[1][0] * m[2][2]) / det,
      (m[0][0] * m[2][2] - m[0][2] * m[2][0]) / det,
      (m[0][2] * m[1][0] - m[0][0] * m[1][2]) / det,
    ],
    [
      (m[1][0] * m[2][1] - m[1][1] * m[2][0]) / det,
      (m[0][1] * m[2][0] - m[0][0] * m[2][1]) / det,
      (m[0][0] * m[1][1] - m[0][1] * m[1][0]) / det,
    ],
  ] as const;
  return {
    toDatum(latDeg, lonDeg, out) {
      toGeocentric(latDeg, lonDeg, WGS84_A, WGS84_E2, g);
      const x = (g[0] as number) - dx;
      const y = (g[1] as number) - dy;
      const z = (g[2] as number) - dz;
      toGeodetic(
        m[0][0] * x + m[0][1] * y + m[0][2] * z,
        m[1][0] * x + m[1][1] * y + m[1][2] * z,
        m[2][0] * x + m[2][1] * y + m[2][2] * z,
        a,
        e2,
        out,
      );
    },
    toWgs84(latDeg, lonDeg, out) {
      // The forward shift starts at zero WGS 84 height and lands at some datum height; starting the
      // way back at zero datum height would miss by up to a millimetre, so the second pass starts
      // at minus the WGS 84 height the first pass produced, making this the forward's inverse.
      let heightM = 0;
      for (let pass = 0; pass < 2; pass++) {
        toGeocentric(latDeg, lonDeg, a, e2, g, heightM);
        const x = g[0] as number;
        const y = g[1] as number;
        const z = g[2] as number;
        toGeodetic(
          inv[0][0] * x + inv[0][1] * y + inv[0][2] * z + dx,
          inv[1][0] * x + inv[1][1] * y + inv[1][2] * z + dy,
          inv[2][0] * x + inv[2][1] * y + inv[2][2] * z + dz,
          WGS84_A,
          WGS84_E2,
          out,
        );
        heightM -= out[2] as number;
      }
    },
  };
}
