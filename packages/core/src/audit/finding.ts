/** How bad a finding is: `info` is worth knowing, `warn` needs a look, `fail` makes the positioning unfit as it stands. */
export type Severity = 'info' | 'warn' | 'fail';

/** The per-dive outcome of an audit: the worst severity among its findings (`info` counts as `pass`). */
export type Verdict = 'pass' | 'warn' | 'fail';

/** The stable names of Leadline's checks; they never change meaning once published. */
export type CheckName =
  | 'time-gap'
  | 'time-backwards'
  | 'repeated-time'
  | 'low-fix-rate'
  | 'too-fast'
  | 'too-sudden'
  | 'position-jump'
  | 'depth-jump'
  | 'impossible-position'
  | 'out-of-reach'
  | 'surface-drift'
  | 'draft-out-of-range'
  | 'depth-sign-doubtful'
  | 'above-surface';

/**
 * One thing an audit noticed, said plainly: which check, how bad, which fixes and times it covers
 * (inclusive 0-based indices into the audited track, UTC ms), what was measured against which limit
 * (in `unit`), and a sentence for people.
 */
export interface Finding {
  check: CheckName;
  severity: Severity;
  startIndex: number;
  endIndex: number;
  startTimeMs: number;
  endTimeMs: number;
  /** The measured value that broke the limit (the worst one over the span); `NaN` when the check has none. */
  measured: number;
  /** The limit it was compared with; `NaN` when the check has none. */
  limit: number;
  /** Unit of `measured` and `limit`, e.g. `s`, `m`, `m/s`, `Hz`, `share`. */
  unit: string;
  message: string;
}
