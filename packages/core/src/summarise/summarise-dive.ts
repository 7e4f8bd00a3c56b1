import { computeSurfaceRange } from '../geodesy/compute-surface-range.js';
import { computeBoundingBox, computeCentroid, measureTrackLength } from '../geodesy/measure-track.js';
import type { Track } from '../model/track.js';

/** A WGS 84 position in a summary. */
export interface SummaryPosition {
  latDeg: number;
  lonDeg: number;
}

/**
 * What a dive amounted to. Every field carries its unit in its name; a value that cannot be known
 * from the log is `null` (never `NaN`, so the object serialises to JSON as is).
 */
export interface DiveSummary {
  /** First and last fix time, UTC ms and ISO 8601. */
  startTimeMs: number | null;
  endTimeMs: number | null;
  startTime: string | null;
  endTime: string | null;
  /** End minus start, seconds. */
  durationS: number | null;
  /** Fixes in the vehicle track (positioned or not). */
  fixCount: number;
  /** Fixes with a latitude and longitude. */
  positionedFixCount: number;
  /** (fixCount − 1) / durationS, fixes per second. */
  meanFixRateHz: number | null;
  /** Horizontal geodesic length on WGS 84, metres. */
  distanceM: number;
  /** Length including depth change, metres. */
  distance3dM: number;
  maxDepthM: number | null;
  /** Mean of the fixes' depths (each fix counts once), metres. */
  meanDepthM: number | null;
  /**
   * Time on bottom, seconds: the summed time between consecutive fixes of one segment that are
   * both at or below `bottomDepthThresholdM`, which is `bottomFraction` (default 0.8) of the
   * maximum depth. Our definition (a bottom band relative to the deepest point, as ROV and diver
   * logs are read in common practice); `null` without depths.
   */
  timeOnBottomS: number | null;
  /** The depth the bottom band starts at, metres. */
  bottomDepthThresholdM: number | null;
  /** Largest horizontal and slant distance from the surface unit to the vehicle, metres. */
  maxHorizontalRangeM: number | null;
  maxSlantRangeM: number | null;
  /** Where the surface-unit positions came from. */
  surfaceSource: 'vehicle-columns' | 'surface-track' | 'none';
  /** `[west, south, east, north]` in degrees; west > east when crossing the antimeridian (RFC 7946 §5.2). */
  bboxDeg: [number, number, number, number] | null;
  startPosition: SummaryPosition | null;
  endPosition: SummaryPosition | null;
  /** Centre of the positioned fixes (mean unit vector). */
  centroid: SummaryPosition | null;
  /** Fixes flagged by the audit, and their share of all fixes (0–1); `null` when no flags were given. */
  flaggedFixCount: number | null;
  flaggedShare: number | null;
}

/** Options of `summariseDive`. */
export interface SummariseDiveOptions {
  /** The surface unit's own track, used for ranges when the vehicle fixes carry no surface position. */
  surface?: Track;
  /** One value per vehicle fix, non-zero when the audit flagged it (for example `auditTrack(...).flags`). */
  flagged?: ArrayLike<number>;
  /** Share of the maximum depth where the bottom band starts; default 0.8. */
  bottomFraction?: number;
}

function firstLastPositioned(track: Track): [number, number] {
  const { latDeg, lonDeg } = track.columns;
  let first = -1;
  let last = -1;
  for (let i = 0; i < track.length; i++) {
    if (Number.isNaN(latDeg[i] as number) || Number.isNaN(lonDeg[i] as number)) continue;
    if (first < 0) first = i;
    last = i;
  }
  return [first, last];
}

function maxOf(values: Float64Array): number | null {
  let max = Number.NEGATIVE_INFINITY;
  for (let i = 0; i < values.length; i++) {
    const v = values[i] as number;
    if (v > max) max = v;
  }
  return max === Number.NEGATIVE_INFINITY ? null : max;
}

/**
 * Summarises one dive from its vehicle track: times, fix count and rate, 2-D and 3-D distance,
 * depths, time on bottom (defined on `DiveSummary.timeOnBottomS`), ranges from the surface unit,
 * box, start/end/centre and the flagged share. Fix times are taken as given (sorted by the reader);
 * an empty track gives nulls and zeros, never `NaN`. Throws `RangeError` if `flagged` is given with a
 * length other than the track's.
 */
export function summariseDive(vehicle: Track, options: SummariseDiveOptions = {}): DiveSummary {
  const { timeMs, latDeg, lonDeg, depthM } = vehicle.columns;
  const n = vehicle.length;
  if (options.flagged && options.flagged.length !== n)
    throw new RangeError(`flagged has ${options.flagged.length} entries for a track of ${n} fixes`);
  let startTimeMs: number | null = null;
  let endTimeMs: number | null = null;
  for (let i = 0; i < n; i++) {
    const t = timeMs[i] as number;
    if (Number.isNaN(t)) continue;
    if (startTimeMs === null || t < startTimeMs) startTimeMs = t;
    if (endTimeMs === null || t > endTimeMs) endTimeMs = t;
  }
  const durationS = startTimeMs !== null && endTimeMs !== null ? (endTimeMs - startTimeMs) / 1000 : null;
  const length = measureTrackLength(vehicle);

  let depthSum = 0;
  let depthCount = 0;
  let maxDepthM = Number.NEGATIVE_INFINITY;
  for (let i = 0; i < n; i++) {
    const d = depthM[i] as number;
    if (Number.isNaN(d)) continue;
    depthSum += d;
    depthCount++;
    if (d > maxDepthM) maxDepthM = d;
  }
  const bottomFraction = options.bottomFraction ?? 0.8;
  let timeOnBottomS: number | null = null;
  let bottomDepthThresholdM: number | null = null;
  if (depthCount > 0) {
    bottomDepthThresholdM = maxDepthM * bottomFraction;
    const segmentStart = new Uint8Array(n);
    for (const s of vehicle.segmentStarts) if (s < n) segmentStart[s] = 1;
    let sumMs = 0;
    for (let i = 1; i < n; i++) {
      if (segmentStart[i] === 1) continue;
      const d0 = depthM[i - 1] as number;
      const d1 = depthM[i] as number;
      const dt = (timeMs[i] as number) - (timeMs[i - 1] as number);
      if (d0 >= bottomDepthThresholdM && d1 >= bottomDepthThresholdM && dt > 0) sumMs += dt;
    }
    timeOnBottomS = sumMs / 1000;
  }

  const ranges = computeSurfaceRange(vehicle, options.surface ? { surface: options.surface } : {});
  const box = computeBoundingBox(latDeg, lonDeg);
  const centre = computeCentroid(latDeg, lonDeg);
  const [first, last] = firstLastPositioned(vehicle);
  let flaggedFixCount: number | null = null;
  if (options.flagged) {
    flaggedFixCount = 0;
    for (let i = 0; i < n; i++) if (options.flagged[i] !== 0) flaggedFixCount++;
  }
  return {
    startTimeMs,
    endTimeMs,
    startTime: startTimeMs === null ? null : new Date(startTimeMs).toISOString(),
    endTime: endTimeMs === null ? null : new Date(endTimeMs).toISOString(),
    durationS,
    fixCount: n,
    positionedFixCount: length.pairCount + (first >= 0 ? 1 : 0),
    meanFixRateHz: durationS !== null && durationS > 0 ? (n - 1) / durationS : null,
    distanceM: length.distanceM,
    distance3dM: length.distance3dM,
    maxDepthM: depthCount > 0 ? maxDepthM : null,
    meanDepthM: depthCount > 0 ? depthSum / depthCount : null,
    timeOnBottomS,
    bottomDepthThresholdM,
    maxHorizontalRangeM: maxOf(ranges.horizontalRangeM),
    maxSlantRangeM: maxOf(ranges.slantRangeM),
    surfaceSource: ranges.surfaceSource,
    bboxDeg: box ? [box.west, box.south, box.east, box.north] : null,
    startPosition: first >= 0 ? { latDeg: latDeg[first] as number, lonDeg: lonDeg[first] as number } : null,
    endPosition: last >= 0 ? { latDeg: latDeg[last] as number, lonDeg: lonDeg[last] as number } : null,
    centroid: centre ?? null,
    flaggedFixCount,
    flaggedShare: flaggedFixCount === null ? null : n > 0 ? flaggedFixCount / n : 0,
  };
}
