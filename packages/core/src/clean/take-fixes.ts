import { FIX_COLUMN_NAMES, type FixColumns, type Track } from '../model/track.js';

/**
 * A new track holding the fixes whose `keep` entry is non-zero, in order, columns copied. Segments
 * start where the original's did (at the next kept fix when a segment's first fix is left out).
 */
export function takeFixes(
  track: Track,
  keep: ArrayLike<number>,
  meta: Partial<Pick<Track, 'id' | 'name'>> = {},
): Track {
  const n = track.length;
  let count = 0;
  for (let i = 0; i < n; i++) if (keep[i]) count++;
  const columns = {} as FixColumns;
  for (const name of FIX_COLUMN_NAMES) columns[name] = new Float64Array(count);
  const sourceLines = new Uint32Array(count);
  const segmentStarts: number[] = [];
  const isStart = new Uint8Array(n);
  for (const s of track.segmentStarts) if (s < n) isStart[s] = 1;
  let k = 0;
  let skipped = false;
  for (let i = 0; i < n; i++) {
    if (!keep[i]) {
      if (isStart[i]) skipped = true; // the segment started on a left-out fix
      continue;
    }
    if (k === 0 || isStart[i] || skipped) segmentStarts.push(k);
    skipped = false;
    for (const name of FIX_COLUMN_NAMES) columns[name][k] = track.columns[name][i] as number;
    sourceLines[k] = track.sourceLines[i] as number;
    k++;
  }
  return { ...track, ...meta, length: count, columns, sourceLines, segmentStarts };
}
