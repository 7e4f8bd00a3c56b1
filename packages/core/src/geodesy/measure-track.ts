/**
 * Distances, speeds, courses, boxes and centres of tracks on WGS 84, columnar and fast. Lines
 * between consecutive fixes use `short-line.ts` (fast path with a measured 0.1 mm bound, GeographicLib
 * beyond); every result is antimeridian-correct.
 */
import type { Track } from '../model/track.js';
import { shortLineDistanceAzimuth, shortLineDistanceM } from './short-line.js';

/** Horizontal and 3-D length of a track. */
export interface TrackLength {
  /** Sum of geodesic distances between consecutive positioned fixes, metres. */
  distanceM: number;
  /**
   * Sum over the same pairs of √(horizontal² + Δdepth²), metres. A pair where either depth is
   * missing contributes its horizontal distance only.
   */
  distance3dM: number;
  /** Number of consecutive pairs measured. */
  pairCount: number;
}

/** Options for track measures. */
export interface MeasureTrackOptions {
  /** Whether the straight line across a gap between segments counts; default `true`. */
  acrossSegments?: boolean;
}

function segmentBreaks(track: Track, options: MeasureTrackOptions): Uint8Array | undefined {
  if (options.acrossSegments !== false || track.segmentStarts.length <= 1) return undefined;
  const breaks = new Uint8Array(track.length);
  for (const start of track.segmentStarts) if (start < track.length) breaks[start] = 1;
  return breaks;
}

/**
 * Length of a track in metres, horizontal (geodesic on WGS 84) and 3-D (with depth change). Fixes
 * with a `NaN` position are skipped: the next positioned fix is measured from the last one.
 * Lines crossing the antimeridian are measured the short way round.
 */
export function measureTrackLength(track: Track, options: MeasureTrackOptions = {}): TrackLength {
  const { latDeg, lonDeg, depthM } = track.columns;
  const breaks = segmentBreaks(track, options);
  let distanceM = 0;
  let distance3dM = 0;
  let pairCount = 0;
  let last = -1;
  for (let i = 0; i < track.length; i++) {
    const lat = latDeg[i] as number;
    const lon = lonDeg[i] as number;
    if (Number.isNaN(lat) || Number.isNaN(lon)) continue;
    if (last >= 0 && !(breaks && breaks[i] === 1)) {
      const d = shortLineDistanceM(latDeg[last] as number, lonDeg[last] as number, lat, lon);
      const dz = (depthM[i] as number) - (depthM[last] as number);
      distanceM += d;
      distance3dM += Number.isNaN(dz) ? d : Math.sqrt(d * d + dz * dz);
      pairCount++;
    }
    last = i;
  }
  return { distanceM, distance3dM, pairCount };
}

/**
 * Distance in metres from the previous positioned fix to each fix (`NaN` for the first fix and
 * for fixes without a position).
 */
export function computeSegmentDistances(track: Track): Float64Array {
  const { latDeg, lonDeg } = track.columns;
  const out = new Float64Array(track.length).fill(Number.NaN);
  let last = -1;
  for (let i = 0; i < track.length; i++) {
    const lat = latDeg[i] as number;
    const lon = lonDeg[i] as number;
    if (Number.isNaN(lat) || Number.isNaN(lon)) continue;
    if (last >= 0) out[i] = shortLineDistanceM(latDeg[last] as number, lonDeg[last] as number, lat, lon);
    last = i;
  }
  return out;
}

/** Speed and course over ground per fix. */
export interface SpeedCourse {
  /** Speed over ground from the previous positioned fix to this one, m/s; `NaN` when unknown. */
  speedMps: Float64Array;
  /** Course over ground of that line at its mid-point, degrees from true north in [0, 360); `NaN` when unknown or stationary. */
  courseDeg: Float64Array;
}

/**
 * Speed (m/s) and course (deg true) over ground of each fix, from the line joining the previous
 * positioned fix to it. `NaN` for the first fix, for a missing position, and where time does not
 * increase; course is `NaN` for a zero-length line. Not smoothed: noisy fixes give noisy speeds.
 */
export function computeSpeedAndCourse(track: Track): SpeedCourse {
  const { latDeg, lonDeg, timeMs } = track.columns;
  const speedMps = new Float64Array(track.length).fill(Number.NaN);
  const courseDeg = new Float64Array(track.length).fill(Number.NaN);
  const scratch = new Float64Array(2);
  let last = -1;
  for (let i = 0; i < track.length; i++) {
    const lat = latDeg[i] as number;
    const lon = lonDeg[i] as number;
    if (Number.isNaN(lat) || Number.isNaN(lon)) continue;
    if (last >= 0) {
      shortLineDistanceAzimuth(latDeg[last] as number, lonDeg[last] as number, lat, lon, scratch);
      const dtS = ((timeMs[i] as number) - (timeMs[last] as number)) / 1000;
      const d = scratch[0] as number;
      if (dtS > 0) speedMps[i] = d / dtS;
      if (d > 0) courseDeg[i] = scratch[1] as number;
    }
    last = i;
  }
  return { speedMps, courseDeg };
}

/** A box in WGS 84 degrees; `west > east` when it crosses the antimeridian (RFC 7946 §5.2). */
export interface BoundingBox {
  west: number;
  south: number;
  east: number;
  north: number;
}

/**
 * The smallest box holding every positioned fix: latitude extent, and the shortest longitude
 * interval covering all longitudes (so a track across 180° gives `west > east`, RFC 7946 §5.2).
 * `undefined` when no fix has a position. Longitudes come back in [-180, 180).
 */
export function computeBoundingBox(latDeg: ArrayLike<number>, lonDeg: ArrayLike<number>): BoundingBox | undefined {
  const n = Math.min(latDeg.length, lonDeg.length);
  let south = Number.POSITIVE_INFINITY;
  let north = Number.NEGATIVE_INFINITY;
  let least = Number.POSITIVE_INFINITY;
  let most = Number.NEGATIVE_INFINITY;
  let unordered = false;
  for (let i = 0; i < n; i++) {
    const lat = latDeg[i] as number;
    const lon = lonDeg[i] as number;
    if (Number.isNaN(lat) || Number.isNaN(lon)) continue;
    if (lat < south) south = lat;
    if (lat > north) north = lat;
    const x = lon >= -180 && lon < 180 ? lon : ((((lon + 180) % 360) + 360) % 360) - 180;
    if (Number.isNaN(x)) unordered = true; // an infinite longitude: left to the general way
    // As the sort below orders them: -0 before 0.
    if (x < least || (x === 0 && least === 0 && 1 / x < 0)) least = x;
    if (x > most || (x === 0 && most === 0 && 1 / x > 0)) most = x;
  }
  if (!(south <= north)) return undefined;
  // Longitudes within less than 180°: the gap round the back is the largest, so the box is
  // simply least to most (no sort needed).
  if (!unordered && most - least < 180) return { west: least, south, east: most, north };
  const lons = new Float64Array(n);
  let m = 0;
  for (let i = 0; i < n; i++) {
    const lat = latDeg[i] as number;
    const lon = lonDeg[i] as number;
    if (Number.isNaN(lat) || Number.isNaN(lon)) continue;
    lons[m++] = lon >= -180 && lon < 180 ? lon : ((((lon + 180) % 360) + 360) % 360) - 180;
  }
  const sorted = lons.subarray(0, m).sort();
  // The box is the complement of the largest empty gap between consecutive longitudes (circularly).
  let gap = (sorted[0] as number) + 360 - (sorted[m - 1] as number);
  let west = sorted[0] as number;
  let east = sorted[m - 1] as number;
  for (let i = 1; i < m; i++) {
    const g = (sorted[i] as number) - (sorted[i - 1] as number);
    if (g > gap) {
      gap = g;
      west = sorted[i] as number;
      east = sorted[i - 1] as number;
    }
  }
  return { west, south, east, north };
}

/**
 * Centre of the positioned fixes: the mean of their unit vectors on the sphere, turned back into
 * latitude and longitude (correct across the antimeridian and near a pole). `undefined` when no
 * fix has a position or the mean vector vanishes (points spread evenly round the globe).
 */
export function computeCentroid(
  latDeg: ArrayLike<number>,
  lonDeg: ArrayLike<number>,
): { latDeg: number; lonDeg: number } | undefined {
  const n = Math.min(latDeg.length, lonDeg.length);
  let x = 0;
  let y = 0;
  let z = 0;
  let count = 0;
  const rad = Math.PI / 180;
  for (let i = 0; i < n; i++) {
    const lat = (latDeg[i] as number) * rad;
    const lon = (lonDeg[i] as number) * rad;
    if (Number.isNaN(lat) || Number.isNaN(lon)) continue;
    const c = Math.cos(lat);
    x += c * Math.cos(lon);
    y += c * Math.sin(lon);
    z += Math.sin(lat);
    count++;
  }
  if (count === 0) return undefined;
  const h = Math.hypot(x, y);
  if (h < 1e-12 * count && Math.abs(z) < 1e-12 * count) return undefined;
  const lon = Math.atan2(y, x) / rad;
  return { latDeg: Math.atan2(z, h) / rad, lonDeg: lon >= 180 ? lon - 360 : lon };
}
