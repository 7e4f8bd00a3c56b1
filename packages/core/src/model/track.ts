/**
 * The one track model every reader produces and every later stage consumes.
 *
 * Fixes are stored column by column in parallel typed arrays indexed by fix, with `NaN` for a
 * value the log did not give. Times are UTC milliseconds since the Unix epoch; positions are
 * WGS 84 latitude and longitude in degrees; depth is metres, positive down.
 */

/** Whose fixes a track holds: the underwater vehicle (or diver), or the topside surface unit. */
export type TrackRole = 'vehicle' | 'surface';

/** A log format Leadline can read or write. */
export type LogFormat = 'gpx' | 'csv' | 'nmea' | 'geojson' | 'kml';

/** What a logged bearing is measured from. */
export type BearingReference = 'relative' | 'true' | 'magnetic' | 'unknown';

/** The names of the per-fix columns, in a stable order. */
export const FIX_COLUMN_NAMES = [
  'timeMs',
  'latDeg',
  'lonDeg',
  'depthM',
  'headingDeg',
  'speedMps',
  'quality',
  'slantRangeM',
  'bearingDeg',
  'surfaceLatDeg',
  'surfaceLonDeg',
  'surfaceHeadingDeg',
] as const;

/** One per-fix column name. */
export type FixColumnName = (typeof FIX_COLUMN_NAMES)[number];

/**
 * Per-fix values as parallel `Float64Array`s of equal length.
 * - `timeMs`: UTC, ms since 1970-01-01.
 * - `latDeg`, `lonDeg`: WGS 84 degrees.
 * - `depthM`: metres below the sea surface (positive down).
 * - `headingDeg`: the platform's heading, degrees clockwise from true north.
 * - `speedMps`: speed over ground as logged, m/s.
 * - `quality`: the log's fix-quality code (for example NMEA GGA quality), `NaN` when absent.
 * - `slantRangeM`, `bearingDeg`: the raw acoustic observation from the transceiver to the vehicle.
 * - `surfaceLatDeg`, `surfaceLonDeg`, `surfaceHeadingDeg`: the surface unit's GNSS position and
 *   heading logged beside the vehicle fix.
 */
export type FixColumns = { [K in FixColumnName]: Float64Array };

/** One fix as a plain object, for building tracks row by row and for tests. */
export type Fix = { timeMs: number; latDeg: number; lonDeg: number } & Partial<
  Record<Exclude<FixColumnName, 'timeMs' | 'latDeg' | 'lonDeg'>, number>
>;

/** How the sign of the vertical coordinate was decided; never a silent guess. */
export interface DepthSignDecision {
  /** `depth`: the log gave depth positive down; `negated-elevation`: depth = -elevation; `none`: no vertical values. */
  rule: 'depth' | 'negated-elevation' | 'none';
  /** Set when the evidence disagrees with the rule (for example elevations all positive underwater). */
  doubtful: boolean;
  /** One sentence saying why, shown in reports. */
  reason: string;
}

/** Where a track came from and how it was interpreted. */
export interface Provenance {
  /** The source file name as the caller gave it. */
  sourceFile: string;
  format: LogFormat;
  /** The detected variant of the format, e.g. `gpx-1.1`, `csv;semicolon;decimal-comma`. */
  dialect: string;
  /** For tabular input: which source column fed which fix column. */
  columnMapping?: Partial<Record<FixColumnName, string>>;
  /** The IANA time zone used to read local times, or `UTC`. */
  timeZone: string;
  depthSign: DepthSignDecision;
  /** What logged bearings are measured from, when the log or the caller says. */
  bearingReference?: BearingReference;
  /** The EPSG code projected input coordinates were converted from, when they were projected. */
  inputCrs?: string;
}

/** A run of fixes. `segmentStarts` holds the index of the first fix of each segment (always starts with 0 when non-empty). */
export interface Track {
  id: string;
  role: TrackRole;
  name?: string;
  /** Number of fixes; every column has this length. */
  length: number;
  columns: FixColumns;
  segmentStarts: number[];
  /** The 1-based source line of each fix, 0 where a format has no lines. */
  sourceLines: Uint32Array;
  provenance: Provenance;
}

/** A named position: a GPX waypoint, a target, a marked object. */
export interface Waypoint {
  name: string;
  latDeg: number;
  lonDeg: number;
  /** Metres positive down, `NaN` when absent. */
  depthM: number;
  /** UTC ms, `NaN` when absent. */
  timeMs: number;
  description?: string;
  /** 1-based source line, 0 when unknown. */
  sourceLine: number;
}

/** Creates an empty set of columns of the given length, every value `NaN`. */
export function createFixColumns(length: number): FixColumns {
  const columns = {} as FixColumns;
  for (const name of FIX_COLUMN_NAMES) columns[name] = new Float64Array(length).fill(Number.NaN);
  return columns;
}

/** Reads fix `index` of a track back as a plain object (omits `NaN` optional values). */
export function getFix(track: Track, index: number): Fix {
  const { columns } = track;
  const fix: Fix = {
    timeMs: columns.timeMs[index] ?? Number.NaN,
    latDeg: columns.latDeg[index] ?? Number.NaN,
    lonDeg: columns.lonDeg[index] ?? Number.NaN,
  };
  for (const name of FIX_COLUMN_NAMES) {
    if (name === 'timeMs' || name === 'latDeg' || name === 'lonDeg') continue;
    const value = columns[name][index];
    if (value !== undefined && !Number.isNaN(value)) fix[name] = value;
  }
  return fix;
}

/** Several tracks' columns, one after another, followed by `more` values, as one array. */
export function joinColumns(columns: readonly ArrayLike<number>[], more: ArrayLike<number> = []): Float64Array {
  const joined = new Float64Array(columns.reduce((n, c) => n + c.length, more.length));
  let at = 0;
  for (const column of columns) {
    joined.set(column, at);
    at += column.length;
  }
  joined.set(more, at);
  return joined;
}

/** Whether a column holds at least one value that is not `NaN`. */
export function hasColumnValues(column: Float64Array): boolean {
  for (let i = 0; i < column.length; i++) if (!Number.isNaN(column[i] as number)) return true;
  return false;
}
