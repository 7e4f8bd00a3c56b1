import type { Track } from '../model/track.js';
import { shortLineDistanceAzimuth } from './short-line.js';

/** Range and bearing from the surface unit to each vehicle fix. */
export interface SurfaceRange {
  /** Geodesic distance from the surface unit to the vehicle fix, metres; `NaN` when unknown. */
  horizontalRangeM: Float64Array;
  /** √(horizontal² + (depth − surface depth)²), metres; `NaN` when the vehicle depth is unknown. */
  slantRangeM: Float64Array;
  /** Direction from the surface unit to the vehicle, degrees true in [0, 360); `NaN` when unknown. */
  bearingDeg: Float64Array;
  /** Where the surface position came from. */
  surfaceSource: 'vehicle-columns' | 'surface-track' | 'none';
}

/** Options of `computeSurfaceRange`. */
export interface SurfaceRangeOptions {
  /** A separate surface-unit track, interpolated linearly in time at each vehicle fix. */
  surface?: Track;
  /** Longest time between two surface fixes to interpolate across, ms; default 10 000. */
  maxInterpolationGapMs?: number;
  /** Depth of the transceiver head below the surface, metres (for the slant range); default 0. */
  transceiverDepthM?: number;
}

/** Index of the last surface fix at or before `t` (binary search), -1 when none. */
function lastAtOrBefore(times: Float64Array, t: number): number {
  let lo = 0;
  let hi = times.length - 1;
  if (hi < 0 || (times[0] as number) > t) return -1;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if ((times[mid] as number) <= t) lo = mid;
    else hi = mid - 1;
  }
  return lo;
}

/**
 * Horizontal range, slant range (m) and bearing (deg true) from the surface unit to each vehicle
 * fix. The surface position is the vehicle track's own `surfaceLatDeg`/`surfaceLonDeg` columns
 * where present, else the `surface` track interpolated linearly in time (never extrapolated, never
 * across a gap longer than `maxInterpolationGapMs`). Values that cannot be known are `NaN`.
 */
export function computeSurfaceRange(vehicle: Track, options: SurfaceRangeOptions = {}): SurfaceRange {
  const n = vehicle.length;
  const horizontalRangeM = new Float64Array(n).fill(Number.NaN);
  const slantRangeM = new Float64Array(n).fill(Number.NaN);
  const bearingDeg = new Float64Array(n).fill(Number.NaN);
  const { latDeg, lonDeg, depthM, timeMs, surfaceLatDeg, surfaceLonDeg } = vehicle.columns;
  const surface = options.surface;
  const maxGapMs = options.maxInterpolationGapMs ?? 10_000;
  const headDepthM = options.transceiverDepthM ?? 0;
  const scratch = new Float64Array(2);
  let usedColumns = false;
  let usedTrack = false;
  for (let i = 0; i < n; i++) {
    const lat = latDeg[i] as number;
    const lon = lonDeg[i] as number;
    if (Number.isNaN(lat) || Number.isNaN(lon)) continue;
    let sLat = surfaceLatDeg[i] as number;
    let sLon = surfaceLonDeg[i] as number;
    if (!Number.isNaN(sLat) && !Number.isNaN(sLon)) usedColumns = true;
    else if (surface && surface.length > 0) {
      const t = timeMs[i] as number;
      const st = surface.columns.timeMs;
      const k = lastAtOrBefore(st, t);
      if (k < 0) continue;
      const t0 = st[k] as number;
      const lat0 = surface.columns.latDeg[k] as number;
      const lon0 = surface.columns.lonDeg[k] as number;
      if (t0 === t) {
        sLat = lat0;
        sLon = lon0;
      } else {
        if (k + 1 >= surface.length) continue;
        const t1 = st[k + 1] as number;
        if (t1 - t0 > maxGapMs || t1 <= t0) continue;
        const w = (t - t0) / (t1 - t0);
        const lat1 = surface.columns.latDeg[k + 1] as number;
        let dLon = (surface.columns.lonDeg[k + 1] as number) - lon0;
        if (dLon >= 180) dLon -= 360;
        else if (dLon < -180) dLon += 360;
        sLat = lat0 + w * (lat1 - lat0);
        sLon = lon0 + w * dLon;
      }
      if (Number.isNaN(sLat) || Number.isNaN(sLon)) continue;
      usedTrack = true;
    } else continue;
    shortLineDistanceAzimuth(sLat, sLon, lat, lon, scratch);
    const h = scratch[0] as number;
    horizontalRangeM[i] = h;
    if (h > 0) bearingDeg[i] = scratch[1] as number;
    const dz = (depthM[i] as number) - headDepthM;
    slantRangeM[i] = Math.sqrt(h * h + dz * dz);
  }
  return {
    horizontalRangeM,
    slantRangeM,
    bearingDeg,
    surfaceSource: usedColumns ? 'vehicle-columns' : usedTrack ? 'surface-track' : 'none',
  };
}
