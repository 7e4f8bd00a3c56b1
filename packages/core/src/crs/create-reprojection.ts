import proj4 from 'proj4';
import { createHelmertShift, type HelmertShift } from '../geodesy/helmert-shift.js';
import { createMercator } from '../geodesy/mercator.js';
import { createTransverseMercator } from '../geodesy/transverse-mercator.js';
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

/** Which code converts: Leadline's own fast paths, or proj4. */
export type ReprojectionEngine =
  | 'transverse-mercator-series'
  | 'mercator'
  | 'helmert+transverse-mercator-series'
  | 'helmert+mercator'
  | 'proj4';

/** A CRS ↔ WGS 84 converter working on columns. */
export interface Reprojection {
  readonly crs: ResolvedCrs;
  /** `transverse-mercator-series` (own Krüger n⁶ code) or `mercator` (own code): fast paths; else `proj4`. */
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

/** A projection with its own columnar code: forward (lon, lat → x, y) and inverse. */
interface ColumnProjection {
  forward(lonDeg: Float64Array, latDeg: Float64Array, x: Float64Array, y: Float64Array): void;
  inverse(x: Float64Array, y: Float64Array, lonDeg: Float64Array, latDeg: Float64Array): void;
}

const DATUM_3PARAM = 1;
const DATUM_7PARAM = 2;
const DATUM_NONE = 5;

// Transverse Mercator and Mercator in metres, with no datum shift between WGS 84 and the CRS as
// proj4 reads the definition (a WGS 84-equivalent datum, or none given): our own code is exact to
// sub-millimetre (checked against PROJ in the tests) and several times faster than proj4's.
function tryFastPath(def: string): { engine: ReprojectionEngine; projection: ColumnProjection } | undefined {
  const parsed = new proj4.Proj(def) as unknown as ParsedProj;
  const name = parsed.projName;
  if (/\+approx\b/.test(def) || /\+(nadgrids|geoidgrids|pm|axis)=/.test(def.replace('+nadgrids=@null', '')))
    return undefined;
  const datumType = parsed.datum?.datum_type;
  const shifted = datumType === DATUM_3PARAM || datumType === DATUM_7PARAM;
  if (datumType !== DATUM_WGS84 && datumType !== DATUM_NONE && !shifted) return undefined;
  if (parsed.to_meter !== undefined && parsed.to_meter !== 1) return undefined;
  if (parsed.axis !== undefined && parsed.axis !== 'enu') return undefined;
  const { a, b } = parsed;
  if (a === undefined || b === undefined) return undefined;
  const lon0Deg = ((parsed.long0 ?? 0) * 180) / Math.PI;
  if (name === 'utm' || name === 'tmerc' || name === 'etmerc') {
    const f = parsed.rf ? 1 / parsed.rf : (a - b) / a;
    const projection = createTransverseMercator({
      a,
      f,
      lon0Deg,
      lat0Deg: ((parsed.lat0 ?? 0) * 180) / Math.PI,
      k0: parsed.k0 ?? 1,
      falseEastingM: parsed.x0 ?? 0,
      falseNorthingM: parsed.y0 ?? 0,
    });
    return withShift('transverse-mercator-series', projection, parsed, shifted);
  }
  if (name === 'merc' && (parsed.lat0 ?? 0) === 0) {
    const projection = createMercator({
      a,
      e2: parsed.es ?? 0,
      lon0Deg,
      // proj4 has already turned a standard parallel (variant B, +lat_ts) into the equator's scale.
      k0: parsed.k0 ?? 1,
      falseEastingM: parsed.x0 ?? 0,
      falseNorthingM: parsed.y0 ?? 0,
    });
    return withShift('mercator', projection, parsed, shifted);
  }
  return undefined;
}

// Puts a Helmert datum shift (3 or 7 parameters, as proj4 parsed them) in front of a fast projection.
function withShift(
  engine: 'transverse-mercator-series' | 'mercator',
  projection: ColumnProjection,
  parsed: ParsedProj,
  shifted: boolean,
): { engine: ReprojectionEngine; projection: ColumnProjection } | undefined {
  if (!shifted) return { engine, projection };
  const p = parsed.datum?.datum_params ?? [];
  if (parsed.a === undefined || parsed.es === undefined || (p.length !== 3 && p.length !== 7)) return undefined;
  const [dx = 0, dy = 0, dz = 0, rx = 0, ry = 0, rz = 0, scale = 1] = p;
  const shift: HelmertShift = createHelmertShift({ dx, dy, dz, rx, ry, rz, scale }, parsed.a, parsed.es);
  const point = new Float64Array(3);
  return {
    engine: `helmert+${engine}`,
    projection: {
      forward(lonDeg, latDeg, x, y) {
        const n = Math.min(lonDeg.length, latDeg.length);
        const lon = new Float64Array(n);
        const lat = new Float64Array(n);
        for (let i = 0; i < n; i++) {
          shift.toDatum(latDeg[i] as number, lonDeg[i] as number, point);
          lat[i] = point[0] as number;
          lon[i] = point[1] as number;
        }
        projection.forward(lon, lat, x, y);
      },
      inverse(x, y, lonDeg, latDeg) {
        projection.inverse(x, y, lonDeg, latDeg);
        for (let i = 0; i < lonDeg.length; i++) {
          shift.toWgs84(latDeg[i] as number, lonDeg[i] as number, point);
          latDeg[i] = point[0] as number;
          lonDeg[i] = point[1] as number;
        }
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
 * Builds a columnar converter between WGS 84 and a resolved CRS. Transverse Mercator, UTM and
 * Mercator (including Pseudo-Mercator), with no datum shift or a 3/7-parameter Helmert one, use
 * Leadline's own code (Krüger series,
 * sub-millimetre, several million points per second); everything else goes through proj4 with the
 * definition `resolveCrs` chose, its inverse polished by one Newton step on the forward where
 * proj4's inverse is a coarser series. A value
 * that cannot be converted comes back `NaN` and its index is listed in `failedIndices`, so a
 * caller can turn it into a `projection-failed` rejection; `NaN` inputs stay `NaN` silently.
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
