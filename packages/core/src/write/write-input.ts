import type { Track, Waypoint } from '../model/track.js';

/** What every writer takes: the tracks (vehicle and surface unit) and the waypoints (targets). */
export interface WriteInput {
  tracks: readonly Track[];
  waypoints: readonly Waypoint[];
}

/** Wraps a longitude into [-180, 180) as GPX and GeoJSON readers expect (+180 becomes −180). */
export function wrapLongitude(lonDeg: number): number {
  if (lonDeg >= -180 && lonDeg < 180) return lonDeg; // untouched: no rounding noise
  return ((((lonDeg + 180) % 360) + 360) % 360) - 180;
}

/**
 * `[start, end)` fix index ranges of a track's segments, in order: the track's own segments, each
 * also cut where consecutive fixes are more than `gapMs` apart (a loss of reception) when given.
 */
export function segmentRanges(track: Track, gapMs?: number): Array<[number, number]> {
  const starts = track.segmentStarts.length > 0 ? track.segmentStarts : track.length > 0 ? [0] : [];
  const ranges: Array<[number, number]> = [];
  const times = track.columns.timeMs;
  for (let s = 0; s < starts.length; s++) {
    const start = starts[s] as number;
    const end = s + 1 < starts.length ? (starts[s + 1] as number) : track.length;
    let from = start;
    if (gapMs !== undefined)
      for (let i = start + 1; i < end; i++)
        if ((times[i] as number) - (times[i - 1] as number) > gapMs) {
          ranges.push([from, i]);
          from = i;
        }
    if (end > from) ranges.push([from, end]);
  }
  return ranges;
}
