import type { Track } from '../model/track.js';
import { takeFixes } from './take-fixes.js';

/** Settings of `splitDives` (the profile's `splitGapS`, `surfaceDepthM`, `surfaceIntervalS`). */
export interface SplitOptions {
  /** A gap between fixes longer than this ends a dive, seconds. */
  splitGapS: number;
  /** A fix shallower than this is at the surface, metres. */
  surfaceDepthM: number;
  /** A stay at the surface at least this long ends a dive, seconds. */
  surfaceIntervalS: number;
}

/** A run of fixes `startIndex`..`endIndex` (inclusive) of the input track. */
export interface FixSpan {
  startIndex: number;
  endIndex: number;
  startTimeMs: number;
  endTimeMs: number;
}

/** One dive cut out of a log. */
export interface DivePart extends FixSpan {
  /** 1-based number of the dive within the log. */
  number: number;
  track: Track;
}

/** What `splitDives` returns: every input fix is in exactly one dive or one surface interval. */
export interface SplitResult {
  dives: DivePart[];
  /** Surface stays long enough to end a dive, and pieces that never went below `surfaceDepthM`. */
  surfaceIntervals: FixSpan[];
}

/**
 * Splits a log into dives: a dive ends at a gap longer than `splitGapS` or at a stay at the surface
 * (depth shallower than `surfaceDepthM`) of at least `surfaceIntervalS`. The surface stays become
 * surface intervals, as do pieces that never went deeper than `surfaceDepthM` (a log without depths
 * splits at gaps only, every piece a dive). Every fix lands in exactly one dive or interval;
 * dive tracks are named `<id>-dive-<nn>`.
 */
export function splitDives(track: Track, options: SplitOptions): SplitResult {
  const n = track.length;
  const { timeMs, depthM } = track.columns;
  const gapMs = options.splitGapS * 1000;
  const surfaceMs = options.surfaceIntervalS * 1000;
  let anyDepth = false;
  for (let i = 0; i < n && !anyDepth; i++) if (!Number.isNaN(depthM[i] as number)) anyDepth = true;
  const atSurface = (i: number): boolean => anyDepth && !((depthM[i] as number) >= options.surfaceDepthM);

  // 1. pieces between long gaps
  const pieces: Array<[number, number]> = [];
  let start = 0;
  for (let i = 1; i <= n; i++) {
    if (i === n || (timeMs[i] as number) - (timeMs[i - 1] as number) > gapMs) {
      if (i > start) pieces.push([start, i - 1]);
      start = i;
    }
  }
  const span = (s: number, e: number): FixSpan => ({
    startIndex: s,
    endIndex: e,
    startTimeMs: timeMs[s] as number,
    endTimeMs: timeMs[e] as number,
  });
  const diveSpans: FixSpan[] = [];
  const surfaceIntervals: FixSpan[] = [];
  const emit = (s: number, e: number): void => {
    if (e < s) return;
    let submerged = !anyDepth;
    for (let i = s; i <= e && !submerged; i++) if (!atSurface(i)) submerged = true;
    (submerged ? diveSpans : surfaceIntervals).push(span(s, e));
  };
  // 2. within each piece, cut out long surface stays
  for (const [s, e] of pieces) {
    let pieceStart = s;
    let i = s;
    while (i <= e) {
      if (!atSurface(i)) {
        i++;
        continue;
      }
      let j = i;
      while (j + 1 <= e && atSurface(j + 1)) j++;
      const long = (timeMs[j] as number) - (timeMs[i] as number) >= surfaceMs;
      if (long) {
        emit(pieceStart, i - 1);
        surfaceIntervals.push(span(i, j));
        pieceStart = j + 1;
      }
      i = j + 1;
    }
    emit(pieceStart, e);
  }
  diveSpans.sort((x, y) => x.startIndex - y.startIndex);
  surfaceIntervals.sort((x, y) => x.startIndex - y.startIndex);
  const dives = diveSpans.map((d, k): DivePart => {
    const keep = new Uint8Array(n);
    keep.fill(1, d.startIndex, d.endIndex + 1);
    const number = k + 1;
    const id = `${track.id}-dive-${String(number).padStart(2, '0')}`;
    return { ...d, number, track: takeFixes(track, keep, { id, name: id }) };
  });
  return { dives, surfaceIntervals };
}
