import type { Rejection } from '../model/rejection.js';
import type { DepthSignDecision, Fix, FixColumnName, Provenance, TrackRole, Waypoint } from '../model/track.js';

/**
 * Many fixes at once, column by column (the fast path of the tabular readers). Arrays may be longer
 * than `count`; only the first `count` values are fixes. The reader reuses the arrays after the
 * consumer asks for the next event, so a consumer copies what it keeps. A column left out is `NaN`;
 * a batch keeps the same columns (the same arrays) once it has been handed on.
 */
export interface FixBatch {
  count: number;
  lines: Uint32Array;
  columns: Partial<Record<FixColumnName, Float64Array>>;
}

/**
 * What a streaming reader yields, in file order. Fixes belong to the track most recently opened
 * by a `track` event; a `segment` event starts a new segment of that track.
 */
export type ReadEvent =
  | {
      kind: 'track';
      role: TrackRole;
      name?: string;
      provenance?: Partial<Provenance>;
      /** Fixes the reader expects in this track (an estimate that sizes its columns once; they still grow). */
      capacityHint?: number;
    }
  | { kind: 'segment' }
  | { kind: 'fix'; fix: Fix; line: number }
  | { kind: 'fix-batch'; batch: FixBatch }
  | { kind: 'waypoint'; waypoint: Waypoint }
  | { kind: 'rejection'; rejection: Rejection }
  /** A source row that is neither a fix nor a rejection on purpose: a header, a comment, an NMEA sentence merged into a neighbouring fix. */
  | { kind: 'non-fix-row'; line: number; why: string }
  /**
   * Several non-fix rows at once, counted: a reader with many of them (NMEA sentences merged into
   * fixes) hands on a count instead of an event per row. The rows may come before or after the fixes
   * around them.
   */
  | { kind: 'non-fix-rows'; count: number }
  /** The depth-sign decision for the current track, when the reader can only make it at the end. */
  | { kind: 'depth-sign'; decision: DepthSignDecision }
  | { kind: 'note'; text: string }
  /** Emitted once at the end: how many source rows the reader saw, counted independently of the outcome. */
  | { kind: 'end'; rowCount: number; dialect: string };
