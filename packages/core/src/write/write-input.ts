import { createFixColumns, type Track, type Waypoint } from '../model/track.js';
import { normaliseLongitudeDeg } from '../model/units.js';

/** What every writer takes: the tracks (vehicle and surface unit) and the waypoints (targets). */
export interface WriteInput {
  tracks: readonly Track[];
  waypoints: readonly Waypoint[];
}

/** Wraps a longitude into [-180, 180) as GPX and GeoJSON readers expect (+180 becomes −180). */
export const wrapLongitude = normaliseLongitudeDeg;

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

/**
 * The input with a separate surface-unit track added for each vehicle track that logged the surface
 * unit's position beside its fixes (`surfaceLatDeg`/`surfaceLonDeg`) when the input holds no surface
 * track of its own, so map formats show the surface unit as its own line. The derived track has id
 * `<vehicle id>#surface`, the vehicle's times and segments, and the surface heading.
 */
export function withSurfaceTracks(input: WriteInput): WriteInput {
  if (input.tracks.some((t) => t.role === 'surface')) return input;
  const derived: Track[] = [];
  for (const track of input.tracks) {
    const c = track.columns;
    // Built column by column (the fixes the vehicle logged a surface position beside).
    let n = 0;
    for (let i = 0; i < track.length; i++)
      if (!Number.isNaN(c.surfaceLatDeg[i] as number) && !Number.isNaN(c.surfaceLonDeg[i] as number)) n++;
    if (n === 0) continue;
    const columns = createFixColumns(n);
    const sourceLines = new Uint32Array(n);
    const segmentStarts: number[] = [];
    const starts = new Set(track.segmentStarts);
    let segmentPending = true;
    let k = 0;
    for (let i = 0; i < track.length; i++) {
      if (starts.has(i)) segmentPending = true;
      const lat = c.surfaceLatDeg[i] as number;
      const lon = c.surfaceLonDeg[i] as number;
      if (Number.isNaN(lat) || Number.isNaN(lon)) continue;
      if (segmentPending) {
        segmentStarts.push(k);
        segmentPending = false;
      }
      columns.timeMs[k] = c.timeMs[i] as number;
      columns.latDeg[k] = lat;
      columns.lonDeg[k] = lon;
      columns.headingDeg[k] = c.surfaceHeadingDeg[i] as number;
      sourceLines[k] = track.sourceLines[i] ?? 0;
      k++;
    }
    derived.push({
      id: `${track.id}#surface`,
      role: 'surface',
      name: `${track.name ?? track.id} (surface unit)`,
      provenance: track.provenance,
      length: n,
      columns,
      segmentStarts,
      sourceLines,
    });
  }
  return derived.length === 0 ? input : { tracks: [...input.tracks, ...derived], waypoints: input.waypoints };
}
