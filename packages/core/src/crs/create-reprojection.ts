import proj4 from 'proj4';
import type { ColumnarProjection } from '../geodesy/columnar-projection.js';
import { createHelmertShift, type HelmertShift, shiftColumns } from '../geodesy/helmert-shift.js';
import { createLambertAzimuthalEqualArea } from '../geodesy/lambert-azimuthal-equal-area.js';
import { createLambertConformalConic } from '../geodesy/lambert-conformal-conic.js';
import { createMercator } from '../geodesy/mercator.js';
import { createPolarStereographic } from '../geodesy/polar-stereographic.js';
import { createTransverseMercator } from '../geodesy/transverse-mercator.js';
import { normaliseLongitudeDeg } from '../model/units.js';
import type { ResolvedCrs } from './resolve-crs.js';

/** Columns reprojected one way, with the indices that could not be (left `NaN`, never hidden). */
export interface ReprojectedColumns {
  /** Easting (m, or the CRS unit) or longitude (deg) for a geographic CRS. */
  x: Float64Array;
  /** Northing (m, or the CRS unit) or latitude (deg) for a geographic CRS. */
  y: Float64Array;
  /** Indices whose input was finite but whose result was not (outside the projection's domain). */
  failedIndices: number[];
}

/** Leadline's own columnar projections. */
type OwnProjection =
  | 'geographic'
  | 'transverse-mercator-series'
  | 'mercator'
  | 'lambert-conformal-conic'
  | 'polar-stereographic'
  | 'lambert-azimuthal-equal-area';

/** Which code converts: Leadline's own fast paths (after a Helmert datum shift where the CRS has one), or proj4. */
export type ReprojectionEngine = OwnProjection | 'proj4' | `helmert+${OwnProjection | 'proj4'}`;

/** A CRS ↔ WGS 84 converter working on columns. */
export interface Reprojection {
  readonly crs: ResolvedCrs;
  /** Leadline's own code (Krüger n⁶ Transverse Mercator, Mercator, LCC, polar stereographic, LAEA), else `proj4`. */
  readonly engine: ReprojectionEngine;
  /** WGS 84 longitude/latitude (deg) to the CRS. */
  forward(lonDeg: Float64Array, latDeg: Float64Array): ReprojectedColumns;
  /** The CRS to WGS 84: `x` is longitude (deg), `y` latitude (deg). */
  inverse(x: Float64Array, y: Float64Array): ReprojectedColumns;
}

interface ParsedProj {
  projName?: string;
  a?: number;
  b?: number;
  rf?: number;
  es?: number;
  lat0?: number;
  lat1?: number;
  lat2?: number;
  lat_ts?: number;
  long0?: number;
  k0?: number;
  x0?: number;
  y0?: number;
  to_meter?: number;
  axis?: string;
  datum?: { datum_type?: number; datum_params?: number[] };
  utmSouth?: boolean;
  zone?: number;
}

const DATUM_WGS84 = 4;
/** Residual above which a proj4 inverse gets a Newton step: 10 µm, or about 10 µm in degrees. */
const POLISH_BELOW_M = 1e-5;
const POLISH_BELOW_DEG = 1e-10;

const DATUM_3PARAM = 1;
const DATUM_7PARAM = 2;
const DATUM_NONE = 5;

const RAD_TO_DEG = 180 / Math.PI;

// The projection methods with our own columnar code, built from the definition as proj4 parsed it,
// or undefined for a method (or aspect) left to proj4.
function createOwnProjection(
  parsed: ParsedProj,
  a: number,
  e2: number,
): { engine: OwnProjection; projection: ColumnarProjection } | undefined {
  const name = parsed.projName;
  const lat0Deg = (parsed.lat0 ?? 0) * RAD_TO_DEG;
  const lon0Deg = (parsed.long0 ?? 0) * RAD_TO_DEG;
  const falseEastingM = parsed.x0 ?? 0;
  const falseNorthingM = parsed.y0 ?? 0;
  if (name === 'utm' || name === 'tmerc' || name === 'etmerc') {
    const f = parsed.rf ? 1 / parsed.rf : (a - (parsed.b ?? a)) / a;
    return {
      engine: 'transverse-mercator-series',
      projection: createTransverseMercator({
        a,
        f,
        lon0Deg,
        lat0Deg,
        k0: parsed.k0 ?? 1,
        falseEastingM,
        falseNorthingM,
      }),
    };
  }
  if (name === 'merc' && lat0Deg === 0) {
    // proj4 has already turned a standard parallel (variant B, +lat_ts) into the equator's scale.
    return {
      engine: 'mercator',
      projection: createMercator({ a, e2, lon0Deg, k0: parsed.k0 ?? 1, falseEastingM, falseNorthingM }),
    };
  }
  if (name === 'lcc') {
    const lat1Deg = (parsed.lat1 ?? parsed.lat0 ?? 0) * RAD_TO_DEG;
    const lat2Deg = parsed.lat2 === undefined ? lat1Deg : parsed.lat2 * RAD_TO_DEG;
    if (Math.abs(lat1Deg + lat2Deg) < 1e-9) return undefined;
    return {
      engine: 'lambert-conformal-conic',
      projection: createLambertConformalConic({
        a,
        e2,
        lat0Deg,
        lon0Deg,
        lat1Deg,
        lat2Deg,
        k0: parsed.k0 ?? 1,
        falseEastingM,
        falseNorthingM,
      }),
    };
  }
  if (name === 'stere' && Math.abs(Math.abs(lat0Deg) - 90) < 1e-10) {
    return {
      engine: 'polar-stereographic',
      projection: createPolarStereographic({
        a,
        e2,
        pole: lat0Deg > 0 ? 'north' : 'south',
        lon0Deg,
        k0: parsed.k0 ?? 1,
        ...(parsed.lat_ts === undefined ? {} : { latTsDeg: parsed.lat_ts * RAD_TO_DEG }),
        falseEastingM,
        falseNorthingM,
      }),
    };
  }
  if (name === 'laea' && Math.abs(lat0Deg) < 90 - 1e-10) {
    return {
      engine: 'lambert-azimuthal-equal-area',
      projection: createLambertAzimuthalEqualArea({ a, e2, lat0Deg, lon0Deg, falseEastingM, falseNorthingM }),
    };
  }
  if (name === 'longlat') return { engine: 'geographic', projection: GEOGRAPHIC };
  return undefined;
}

// A geographic CRS: longitude and latitude in degrees, as they are (any datum shift comes before).
const GEOGRAPHIC: ColumnarProjection = {
  forward(lonDeg, latDeg, x, y) {
    x.set(lonDeg.subarray(0, x.length));
    y.set(latDeg.subarray(0, y.length));
  },
  inverse(x, y, lonDeg, latDeg) {
    lonDeg.set(x.subarray(0, lonDeg.length));
    latDeg.set(y.subarray(0, latDeg.length));
  },
};

/** proj4's projection object as its methods work: radians and metres, false origin included. */
interface Proj4Projection {
  forward(point: { x: number; y: number }): { x: number; y: number } | undefined;
  inverse(point: { x: number; y: number }): { x: number; y: number } | undefined;
}

/** A point within this many metres (each axis) of the previous one starts from it (a track). */
const CONTINUE_WITHIN_M = 100;
/** A track's predicted start missing by more than this (m) is replaced by proj4's inverse. */
const PREDICTION_TRUSTED_M = 0.01;
/** A Jacobian is reused for points within this many degrees of where it was taken (tracks move slowly). */
const JACOBIAN_REUSE_DEG = 0.01;

// Any other projection method, through proj4's own projection object called directly (radians in
// and out, no per-point datum or axis handling), on columns. Some proj4 inverses are series good
// to a few millimetres; one Newton step on the exact forward brings them to the forward's accuracy,
// with the Jacobian reused between neighbouring points. Along a track the inverse starts from the
// previous point instead of calling proj4's inverse, so a point usually costs one forward.
function createProj4Projection(proj: Proj4Projection): ColumnarProjection {
  const point = { x: 0, y: 0 };
  function forwardAt(lonDeg: number, latDeg: number, out: Float64Array): void {
    point.x = lonDeg / RAD_TO_DEG;
    point.y = latDeg / RAD_TO_DEG;
    let r: { x: number; y: number } | undefined;
    try {
      r = proj.forward(point);
    } catch {
      r = undefined;
    }
    out[0] = r === undefined ? Number.NaN : r.x;
    out[1] = r === undefined ? Number.NaN : r.y;
  }
  const f = new Float64Array(2);
  const f0 = new Float64Array(2);
  const fLon = new Float64Array(2);
  const fLat = new Float64Array(2);
  const jacobian = { lon: Number.NaN, lat: Number.NaN, j11: 0, j12: 0, j21: 0, j22: 0 };
  const jacobianHolds = (lon: number, lat: number) =>
    Math.abs(lon - jacobian.lon) < JACOBIAN_REUSE_DEG && Math.abs(lat - jacobian.lat) < JACOBIAN_REUSE_DEG;
  // ∂(x, y)/∂(lon, lat) in metres per degree, by forward differences.
  function takeJacobian(lon: number, lat: number): void {
    const h = 1e-7;
    forwardAt(lon, lat, f0);
    forwardAt(lon + h, lat, fLon);
    forwardAt(lon, lat + h, fLat);
    jacobian.lon = lon;
    jacobian.lat = lat;
    jacobian.j11 = ((fLon[0] as number) - (f0[0] as number)) / h;
    jacobian.j21 = ((fLon[1] as number) - (f0[1] as number)) / h;
    jacobian.j12 = ((fLat[0] as number) - (f0[0] as number)) / h;
    jacobian.j22 = ((fLat[1] as number) - (f0[1] as number)) / h;
  }
  return {
    forward(lonDeg, latDeg, x, y) {
      const n = Math.min(lonDeg.length, latDeg.length);
      for (let i = 0; i < n; i++) {
        forwardAt(lonDeg[i] as number, latDeg[i] as number, f);
        x[i] = f[0] as number;
        y[i] = f[1] as number;
      }
    },
    inverse(x, y, lonDeg, latDeg) {
      const n = Math.min(x.length, y.length);
      let previousX = Number.NaN;
      let previousY = Number.NaN;
      let previousLon = Number.NaN;
      let previousLat = Number.NaN;
      for (let i = 0; i < n; i++) {
        const targetX = x[i] as number;
        const targetY = y[i] as number;
        let lon = Number.NaN;
        let lat = Number.NaN;
        const dx = targetX - previousX;
        const dy = targetY - previousY;
        let rx = Number.NaN;
        let ry = Number.NaN;
        if (
          Math.abs(dx) < CONTINUE_WITHIN_M &&
          Math.abs(dy) < CONTINUE_WITHIN_M &&
          jacobianHolds(previousLon, previousLat)
        ) {
          // A track: start from the previous point moved by the Jacobian (off by micrometres to a
          // millimetre within 100 m), instead of proj4's inverse, which is often an iteration itself.
          const { j11, j12, j21, j22 } = jacobian;
          const det = j11 * j22 - j12 * j21;
          lon = previousLon + (j22 * dx - j12 * dy) / det;
          lat = previousLat + (j11 * dy - j21 * dx) / det;
          forwardAt(lon, lat, f);
          rx = targetX - (f[0] as number);
          ry = targetY - (f[1] as number);
        }
        // Not on a track, or the prediction missed by a centimetre or more (a seam of the projection):
        // proj4's own inverse.
        if (!(Math.abs(rx) < PREDICTION_TRUSTED_M && Math.abs(ry) < PREDICTION_TRUSTED_M)) {
          lon = Number.NaN;
          lat = Number.NaN;
          point.x = targetX;
          point.y = targetY;
          let r: { x: number; y: number } | undefined;
          try {
            r = Number.isNaN(targetX) || Number.isNaN(targetY) ? undefined : proj.inverse(point);
          } catch {
            r = undefined;
          }
          if (r !== undefined) {
            lon = normaliseLongitudeDeg(r.x * RAD_TO_DEG);
            lat = r.y * RAD_TO_DEG;
            forwardAt(lon, lat, f);
            rx = targetX - (f[0] as number);
            ry = targetY - (f[1] as number);
          }
        }
        if (!Number.isFinite(lon) || !Number.isFinite(lat)) {
          lonDeg[i] = Number.NaN;
          latDeg[i] = Number.NaN;
          previousX = Number.NaN;
          continue;
        }
        // One Newton step on the exact forward where the start misses by 10 µm or more.
        if (Number.isFinite(rx) && Number.isFinite(ry) && Math.sqrt(rx * rx + ry * ry) >= POLISH_BELOW_M) {
          if (!jacobianHolds(lon, lat)) takeJacobian(lon, lat);
          const { j11, j12, j21, j22 } = jacobian;
          const det = j11 * j22 - j12 * j21;
          const dLon = (j22 * rx - j12 * ry) / det;
          const dLat = (j11 * ry - j21 * rx) / det;
          if (Number.isFinite(det) && det !== 0 && Math.abs(dLon) < 1e-3 && Math.abs(dLat) < 1e-3) {
            lon += dLon;
            lat += dLat;
          }
        }
        lonDeg[i] = lon;
        latDeg[i] = lat;
        if (!jacobianHolds(lon, lat)) takeJacobian(lon, lat);
        previousX = targetX;
        previousY = targetY;
        previousLon = lon;
        previousLat = lat;
      }
    },
  };
}

// Our own code for the common projection methods, with no datum shift between WGS 84 and the CRS
// as proj4 reads the definition (a WGS 84-equivalent datum, or none given) or a 3/7-parameter
// Helmert one, in metres or another linear unit: exact to sub-millimetre (checked against PROJ in
// the tests) and several times faster than proj4's point-by-point path.
function tryFastPath(def: string): { engine: ReprojectionEngine; projection: ColumnarProjection } | undefined {
  const parsed = new proj4.Proj(def) as unknown as ParsedProj;
  if (/\+approx\b/.test(def) || /\+(nadgrids|geoidgrids|pm|axis)=/.test(def.replace('+nadgrids=@null', '')))
    return undefined;
  const datumType = parsed.datum?.datum_type;
  const shifted = datumType === DATUM_3PARAM || datumType === DATUM_7PARAM;
  if (datumType !== DATUM_WGS84 && datumType !== DATUM_NONE && !shifted) return undefined;
  if (parsed.axis !== undefined && parsed.axis !== 'enu') return undefined;
  const { a, b } = parsed;
  if (a === undefined || b === undefined) return undefined;
  const e2 = parsed.es ?? 1 - (b * b) / (a * a);
  const own = createOwnProjection(parsed, a, e2) ?? {
    engine: 'proj4' as const,
    projection: createProj4Projection(parsed as unknown as Proj4Projection),
  };
  const shiftedOwn = withShift(own.engine, own.projection, parsed, shifted);
  if (shiftedOwn === undefined) return undefined;
  const toMetre = parsed.to_meter ?? 1;
  return toMetre === 1 ? shiftedOwn : { engine: shiftedOwn.engine, projection: inUnit(shiftedOwn.projection, toMetre) };
}

// The same projection with easting and northing in a unit of `toMetre` metres (US survey feet, say).
function inUnit(projection: ColumnarProjection, toMetre: number): ColumnarProjection {
  return {
    forward(lonDeg, latDeg, x, y) {
      projection.forward(lonDeg, latDeg, x, y);
      for (let i = 0; i < x.length; i++) {
        x[i] = (x[i] as number) / toMetre;
        y[i] = (y[i] as number) / toMetre;
      }
    },
    inverse(x, y, lonDeg, latDeg) {
      const n = Math.min(x.length, y.length);
      const xM = new Float64Array(n);
      const yM = new Float64Array(n);
      for (let i = 0; i < n; i++) {
        xM[i] = (x[i] as number) * toMetre;
        yM[i] = (y[i] as number) * toMetre;
      }
      projection.inverse(xM, yM, lonDeg, latDeg);
    },
  };
}

// Puts a Helmert datum shift (3 or 7 parameters, as proj4 parsed them) in front of a fast projection.
function withShift(
  engine: OwnProjection | 'proj4',
  projection: ColumnarProjection,
  parsed: ParsedProj,
  shifted: boolean,
): { engine: ReprojectionEngine; projection: ColumnarProjection } | undefined {
  if (!shifted) return { engine, projection };
  const p = parsed.datum?.datum_params ?? [];
  if (parsed.a === undefined || parsed.es === undefined || (p.length !== 3 && p.length !== 7)) return undefined;
  // A 3-parameter datum keeps seven slots in proj4, the last four zero: translation only.
  const [dx = 0, dy = 0, dz = 0] = p;
  const [rx = 0, ry = 0, rz = 0, scale = 1] = parsed.datum?.datum_type === DATUM_7PARAM ? p.slice(3) : [];
  const shift: HelmertShift = createHelmertShift({ dx, dy, dz, rx, ry, rz, scale }, parsed.a, parsed.es);
  return {
    engine: `helmert+${engine}`,
    projection: {
      forward(lonDeg, latDeg, x, y) {
        const n = Math.min(lonDeg.length, latDeg.length);
        const lon = new Float64Array(n);
        const lat = new Float64Array(n);
        shiftColumns(shift.toDatum, latDeg, lonDeg, lat, lon);
        projection.forward(lon, lat, x, y);
      },
      inverse(x, y, lonDeg, latDeg) {
        projection.inverse(x, y, lonDeg, latDeg);
        shiftColumns(shift.toWgs84, latDeg, lonDeg, latDeg, lonDeg);
      },
    },
  };
}

function collectFailures(inA: Float64Array, inB: Float64Array, outA: Float64Array, outB: Float64Array): number[] {
  const failed: number[] = [];
  for (let i = 0; i < outA.length; i++) {
    const ok = Number.isFinite(outA[i] as number) && Number.isFinite(outB[i] as number);
    if (ok) continue;
    outA[i] = Number.NaN;
    outB[i] = Number.NaN;
    if (!Number.isNaN(inA[i] as number) && !Number.isNaN(inB[i] as number)) failed.push(i);
  }
  return failed;
}

/**
 * Builds a columnar converter between WGS 84 and a resolved CRS. Transverse Mercator and UTM
 * (Krüger n⁶ series), Mercator (including Pseudo-Mercator), Lambert Conic Conformal, polar
 * stereographic, Lambert Azimuthal Equal Area and geographic CRSs use Leadline's own code; any
 * other projection method uses proj4's projection called directly on each point, its inverse
 * polished by one Newton step where proj4's inverse is a coarser series. A 3/7-parameter Helmert
 * datum shift goes in front (interpolated within a track's cells, see `shiftColumns`), and linear
 * units other than the metre are scaled. Definitions with grids, a prime meridian or a swapped
 * axis order go through proj4's full transform. All of this agrees with PROJ to under 1 mm (tests).
 * A value that cannot be converted comes back `NaN` and its index is listed in `failedIndices`,
 * so a caller can turn it into a `projection-failed` rejection; `NaN` inputs stay `NaN` silently.
 */
export function createReprojection(crs: ResolvedCrs): Reprojection {
  const fast = tryFastPath(crs.proj4);
  if (fast) {
    const { projection } = fast;
    return {
      crs,
      engine: fast.engine,
      forward(lonDeg, latDeg) {
        const n = Math.min(lonDeg.length, latDeg.length);
        const x = new Float64Array(n);
        const y = new Float64Array(n);
        projection.forward(lonDeg, latDeg, x, y);
        return { x, y, failedIndices: collectFailures(lonDeg, latDeg, x, y) };
      },
      inverse(xIn, yIn) {
        const n = Math.min(xIn.length, yIn.length);
        const x = new Float64Array(n);
        const y = new Float64Array(n);
        projection.inverse(xIn, yIn, x, y);
        return { x, y, failedIndices: collectFailures(xIn, yIn, x, y) };
      },
    };
  }
  const converter = proj4('WGS84', crs.proj4);
  function run(direction: 'forward' | 'inverse', xIn: Float64Array, yIn: Float64Array): ReprojectedColumns {
    const n = Math.min(xIn.length, yIn.length);
    const x = new Float64Array(n);
    const y = new Float64Array(n);
    const point = [0, 0];
    for (let i = 0; i < n; i++) {
      const xi = xIn[i] as number;
      const yi = yIn[i] as number;
      if (Number.isNaN(xi) || Number.isNaN(yi)) {
        x[i] = Number.NaN;
        y[i] = Number.NaN;
        continue;
      }
      point[0] = xi;
      point[1] = yi;
      try {
        const r = converter[direction](point);
        x[i] = r[0] as number;
        y[i] = r[1] as number;
        if (direction === 'inverse') polishInverse(xi, yi, x, y, i);
      } catch {
        x[i] = Number.NaN;
        y[i] = Number.NaN;
      }
    }
    return { x, y, failedIndices: collectFailures(xIn, yIn, x, y) };
  }
  // Some proj4 inverses are series approximations good to a few millimetres (LAEA's authalic
  // latitude, for one); one Newton step on the exact forward brings them to the forward's accuracy.
  const polishBelow = crs.kind === 'geographic' ? POLISH_BELOW_DEG : POLISH_BELOW_M;
  const probe = [0, 0];
  function forwardAt(lon: number, lat: number): [number, number] {
    probe[0] = lon;
    probe[1] = lat;
    const r = converter.forward(probe);
    return [r[0] as number, r[1] as number];
  }
  function polishInverse(
    targetX: number,
    targetY: number,
    lonOut: Float64Array,
    latOut: Float64Array,
    i: number,
  ): void {
    const lon = lonOut[i] as number;
    const lat = latOut[i] as number;
    if (!Number.isFinite(lon) || !Number.isFinite(lat)) return;
    const [fx, fy] = forwardAt(lon, lat);
    const rx = targetX - fx;
    const ry = targetY - fy;
    if (!Number.isFinite(rx) || !Number.isFinite(ry) || Math.hypot(rx, ry) < polishBelow) return;
    const h = 1e-7;
    const [ax, ay] = forwardAt(lon + h, lat);
    const [bx, by] = forwardAt(lon, lat + h);
    const j11 = (ax - fx) / h;
    const j21 = (ay - fy) / h;
    const j12 = (bx - fx) / h;
    const j22 = (by - fy) / h;
    const det = j11 * j22 - j12 * j21;
    if (!Number.isFinite(det) || det === 0) return;
    const dLon = (j22 * rx - j12 * ry) / det;
    const dLat = (j11 * ry - j21 * rx) / det;
    if (Math.abs(dLon) < 1e-3 && Math.abs(dLat) < 1e-3) {
      lonOut[i] = lon + dLon;
      latOut[i] = lat + dLat;
    }
  }
  return {
    crs,
    engine: 'proj4',
    forward: (lonDeg, latDeg) => run('forward', lonDeg, latDeg),
    inverse: (x, y) => run('inverse', x, y),
  };
}
