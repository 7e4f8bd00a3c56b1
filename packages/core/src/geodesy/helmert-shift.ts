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

import { normaliseLongitudeDeg } from '../model/units.js';

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

/** Constants of one ellipsoid for Bowring's geocentric → geodetic conversion. */
interface Ellipsoid {
  a: number;
  b: number;
  e2: number;
  /** Second eccentricity squared, e² / (1 − e²). */
  ep2: number;
}

function ellipsoid(a: number, e2: number): Ellipsoid {
  return { a, b: a * Math.sqrt(1 - e2), e2, ep2: e2 / (1 - e2) };
}

// Bowring's (1976) closed form from the parametric latitude, applied twice: for points within
// kilometres of the ellipsoid (all a datum shift produces) the second pass is below 1e-12 rad, and
// neither pass needs a trigonometric call: one atan2 for each of latitude and longitude at the end.
function toGeodetic(x: number, y: number, z: number, el: Ellipsoid, out: Float64Array): void {
  const { a, b, e2, ep2 } = el;
  const p = Math.sqrt(x * x + y * y);
  let az = a * z;
  let bp = b * p;
  let num = 0;
  let den = 1;
  let sinLat = 0;
  let cosLat = 1;
  for (let pass = 0; pass < 2; pass++) {
    const r = Math.sqrt(az * az + bp * bp);
    const su = r === 0 ? 0 : az / r;
    const cu = r === 0 ? 1 : bp / r;
    num = z + ep2 * b * su * su * su;
    den = p - e2 * a * cu * cu * cu;
    const rr = Math.sqrt(num * num + den * den);
    sinLat = num / rr;
    cosLat = den / rr;
    // tan u = (b/a)·tan φ for the next pass.
    az = b * sinLat;
    bp = a * cosLat;
  }
  out[0] = Math.atan2(num, den) / DEG;
  out[1] = Math.atan2(y, x) / DEG;
  out[2] = p * cosLat + z * sinLat - a * Math.sqrt(1 - e2 * sinLat * sinLat);
}

/** Builds the shift between WGS 84 and a datum on the ellipsoid (`a` metres, `e2` eccentricity²). */
export function createHelmertShift(params: HelmertParams, a: number, e2: number): HelmertShift {
  const { dx, dy, dz, rx, ry, rz, scale } = params;
  const g = new Float64Array(3);
  const wgs84 = ellipsoid(WGS84_A, WGS84_E2);
  const datum = ellipsoid(a, e2);
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
        datum,
        out,
      );
    },
    toWgs84(latDeg, lonDeg, out) {
      // The forward shift starts at zero WGS 84 height and lands at some datum height h; the way
      // back must start at that h, not at zero (a miss of up to a millimetre). h is minus the WGS 84
      // height of the point at zero datum height, read along the datum normal (φ and λ differ from
      // the WGS 84 ones by seconds of arc, which changes that height by micrometres).
      const lat = latDeg * DEG;
      const lon = lonDeg * DEG;
      const sinLat = Math.sin(lat);
      const cosLat = Math.cos(lat);
      const cosLon = Math.cos(lon);
      const sinLon = Math.sin(lon);
      const nu = a / Math.sqrt(1 - e2 * sinLat * sinLat);
      const px = nu * cosLat * cosLon;
      const py = nu * cosLat * sinLon;
      const pz = nu * (1 - e2) * sinLat;
      const qx = inv[0][0] * px + inv[0][1] * py + inv[0][2] * pz + dx;
      const qy = inv[1][0] * px + inv[1][1] * py + inv[1][2] * pz + dy;
      const qz = inv[2][0] * px + inv[2][1] * py + inv[2][2] * pz + dz;
      const heightWgs84M =
        Math.sqrt(qx * qx + qy * qy) * cosLat + qz * sinLat - WGS84_A * Math.sqrt(1 - WGS84_E2 * sinLat * sinLat);
      // Moving the start by h along the datum normal moves the WGS 84 point by h along M⁻¹·normal.
      const h = -heightWgs84M;
      const nx = cosLat * cosLon * h;
      const ny = cosLat * sinLon * h;
      const nz = sinLat * h;
      toGeodetic(
        qx + inv[0][0] * nx + inv[0][1] * ny + inv[0][2] * nz,
        qy + inv[1][0] * nx + inv[1][1] * ny + inv[1][2] * nz,
        qz + inv[2][0] * nx + inv[2][1] * ny + inv[2][2] * nz,
        wgs84,
        out,
      );
    },
  };
}

/** Cell size of the interpolated shift, degrees: 1/256° (about 430 m), where bilinear interpolation of the smooth shift field stays within 10 µm up to 80° latitude (measured in the tests: at most 6 µm, most places under 1 µm; 1/64° missed by up to 13 µm at mid-latitudes). */
const CELL_DEG = 1 / 256;
/** Beyond this latitude the shift in longitude changes too fast for the cells; every point is shifted exactly. */
const CELL_MAX_LAT_DEG = 80;

/**
 * Shifts columns of latitude/longitude (degrees) one way, in place into `latOut`/`lonOut`. The shift
 * is a smooth field (tens to hundreds of metres, changing over thousands of kilometres), so where
 * consecutive points fall in the same 1/256° cell — a track does, point after point — the shift is
 * interpolated bilinearly from the corners, each computed exactly: within 10 µm of
 * the exact shift (checked in the tests) at a fraction of its cost. Scattered points are shifted
 * exactly one by one. `NaN` in gives `NaN` out.
 */
export function shiftColumns(
  shiftPoint: (latDeg: number, lonDeg: number, out: Float64Array) => void,
  latDeg: Float64Array,
  lonDeg: Float64Array,
  latOut: Float64Array,
  lonOut: Float64Array,
): void {
  const point = new Float64Array(3);
  const corners = new Float64Array(8); // dLat, dLon at (0,0), (1,0), (0,1), (1,1) in (lat, lon) cell units
  let cellLat = Number.NaN;
  let cellLon = Number.NaN;
  let cellReady = false;
  const n = Math.min(latDeg.length, lonDeg.length, latOut.length, lonOut.length);
  for (let i = 0; i < n; i++) {
    const lat = latDeg[i] as number;
    const lon = lonDeg[i] as number;
    const iLat = Math.floor(lat / CELL_DEG);
    const iLon = Math.floor(lon / CELL_DEG);
    const sameCell = iLat === cellLat && iLon === cellLon;
    if (!sameCell) {
      cellLat = iLat;
      cellLon = iLon;
      cellReady = false;
    }
    if (!sameCell || Math.abs(lat) > CELL_MAX_LAT_DEG || !Number.isFinite(lat + lon)) {
      shiftPoint(lat, lon, point);
      latOut[i] = point[0] as number;
      lonOut[i] = point[1] as number;
      continue;
    }
    if (!cellReady) {
      for (let k = 0; k < 4; k++) {
        const cornerLat = (iLat + (k & 1)) * CELL_DEG;
        const cornerLon = (iLon + (k >> 1)) * CELL_DEG;
        shiftPoint(cornerLat, cornerLon, point);
        corners[2 * k] = (point[0] as number) - cornerLat;
        corners[2 * k + 1] = normaliseLongitudeDeg((point[1] as number) - cornerLon);
      }
      cellReady = true;
    }
    const u = lat / CELL_DEG - iLat;
    const v = lon / CELL_DEG - iLon;
    const w00 = (1 - u) * (1 - v);
    const w10 = u * (1 - v);
    const w01 = (1 - u) * v;
    const w11 = u * v;
    latOut[i] =
      lat +
      w00 * (corners[0] as number) +
      w10 * (corners[2] as number) +
      w01 * (corners[4] as number) +
      w11 * (corners[6] as number);
    lonOut[i] = normaliseLongitudeDeg(
      lon +
        w00 * (corners[1] as number) +
        w10 * (corners[3] as number) +
        w01 * (corners[5] as number) +
        w11 * (corners[7] as number),
    );
  }
}
