import type { Track } from '../model/track.js';
import { takeFixes } from './take-fixes.js';

/**
 * Leaves out every fix whose flag is non-zero (the audit's per-fix flags) and returns the rest as
 * a new track with the dropped count. Keeping flagged fixes is simply not calling this.
 */
export function dropFlaggedFixes(track: Track, flags: ArrayLike<number>): { track: Track; droppedCount: number } {
  const keep = new Uint8Array(track.length);
  let dropped = 0;
  for (let i = 0; i < track.length; i++) {
    if (flags[i]) dropped++;
    else keep[i] = 1;
  }
  return { track: takeFixes(track, keep), droppedCount: dropped };
}
