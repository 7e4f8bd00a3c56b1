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

/** `[start, end)` fix index ranges of a track's segments, in order. */
export function segmentRanges(track: Track): Array<[number, number]> {
  const starts = track.segmentStarts.length > 0 ? track.segmentStarts : track.length > 0 ? [0] : [];
  const ranges: Array<[number, number]> = [];
  for (let s = 0; s < starts.length; s++) {
    const start = starts[s] as number;
    const end = s + 1 < starts.length ? (starts[s + 1] as number) : track.length;
    if (end > start) ranges.push([start, end]);
  }
  return ranges;
}
