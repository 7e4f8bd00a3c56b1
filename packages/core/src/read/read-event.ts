import type { Rejection } from '../model/rejection.js';
import type { DepthSignDecision, Fix, Provenance, TrackRole, Waypoint } from '../model/track.js';

/**
 * What a streaming reader yields, in file order. Fixes belong to the track most recently opened
 * by a `track` event; a `segment` event starts a new segment of that track.
 */
export type ReadEvent =
  | { kind: 'track'; role: TrackRole; name?: string; provenance?: Partial<Provenance> }
  | { kind: 'segment' }
  | { kind: 'fix'; fix: Fix; line: number }
  | { kind: 'waypoint'; waypoint: Waypoint }
  | { kind: 'rejection'; rejection: Rejection }
  /** A source row that is neither a fix nor a rejection on purpose: a header, a comment, an NMEA sentence merged into a neighbouring fix. */
  | { kind: 'non-fix-row'; line: number; why: string }
  /** The depth-sign decision for the current track, when the reader can only make it at the end. */
  | { kind: 'depth-sign'; decision: DepthSignDecision }
  | { kind: 'note'; text: string }
  /** Emitted once at the end: how many source rows the reader saw, counted independently of the outcome. */
  | { kind: 'end'; rowCount: number; dialect: string };
