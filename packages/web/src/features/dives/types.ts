/**
 * The plain props the dive view takes. Columns are parallel arrays indexed by fix (typed arrays or
 * plain number arrays from JSON), `NaN` for a value the log did not give, so the view works with
 * whatever the API returns as long as it is mapped into these shapes.
 */

/** How bad a finding is. */
export type Severity = 'info' | 'warn' | 'fail';

/** The per-dive outcome of the audit. */
export type Verdict = 'pass' | 'warn' | 'fail';

/** One column of per-fix numbers; `NaN` marks a missing value. */
export type NumberColumn = ArrayLike<number>;

/** The vehicle's fixes: UTC ms, WGS 84 degrees, depth in metres positive down. */
export interface VehicleColumns {
  timeMs: NumberColumn;
  latDeg: NumberColumn;
  lonDeg: NumberColumn;
  depthM: NumberColumn;
}

/** The surface unit's own fixes: UTC ms and WGS 84 degrees. */
export interface SurfaceColumns {
  timeMs: NumberColumn;
  latDeg: NumberColumn;
  lonDeg: NumberColumn;
}

/** One audit finding, spanning vehicle fixes `startIndex`..`endIndex` (inclusive, 0-based). */
export interface DiveFinding {
  id: string;
  /** The check's stable name, e.g. `position-jump`. */
  check: string;
  severity: Severity;
  startIndex: number;
  endIndex: number;
  startTimeMs: number;
  endTimeMs: number;
  message: string;
}

/** What the dive amounted to; `null` where the log cannot tell. */
export interface DiveSummaryView {
  startTimeMs: number | null;
  endTimeMs: number | null;
  durationS: number | null;
  fixCount: number;
  meanFixRateHz: number | null;
  distanceM: number | null;
  distance3dM: number | null;
  maxDepthM: number | null;
  meanDepthM: number | null;
  timeOnBottomS: number | null;
  maxHorizontalRangeM: number | null;
  maxSlantRangeM: number | null;
  /** Share of fixes flagged by the audit, 0–1. */
  flaggedShare: number | null;
}

/** How many fixes meet one IHO S-44 order. */
export interface S44ShareView {
  /** `exclusive`, `special`, `1a`, `1b`, `2`. */
  order: string;
  /** The order's name as S-44 prints it. */
  label: string;
  /** Fixes whose uncertainty could be judged. */
  judged: number;
  /** Fixes meeting the order. */
  meeting: number;
  /** meeting / judged, `null` when nothing could be judged. */
  share: number | null;
}

/** A coordinate reference system the grid can be labelled in (a PROJ.4 definition in metres). */
export interface GridCrsChoice {
  /** `EPSG:32632`. */
  code: string;
  name: string;
  proj4: string;
}

/** Where an archived dive lives, for its downloads, history and reprocessing. */
export interface DiveArchiveRef {
  organisationId: string;
  projectId: string;
  logId: string;
  /** The latest result (the one shown). */
  resultId: string;
  logFileName: string;
}

/** Everything the dive view shows. */
export interface DiveViewData {
  id: string;
  title: string;
  /** A line under the title: site, vehicle, log file. */
  subtitle?: string;
  verdict: Verdict;
  vehicle: VehicleColumns;
  surface?: SurfaceColumns;
  /**
   * Per-fix severity of the worst finding covering it: 0 none, 1 info, 2 warn, 3 fail. Derived from
   * the findings' spans when absent.
   */
  fixSeverity?: NumberColumn;
  findings: readonly DiveFinding[];
  summary: DiveSummaryView;
  s44: readonly S44ShareView[];
  /** Projected CRSs offered for the grid besides the local frame and the dive's UTM zone. */
  crsChoices?: readonly GridCrsChoice[];
  /** Present for a dive from the archive (absent for a preview). */
  archive?: DiveArchiveRef;
}

/** What the plan view and the profile colour the vehicle track by. */
export type ColourMode = 'depth' | 'time';
