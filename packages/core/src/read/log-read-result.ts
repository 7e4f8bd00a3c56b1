import type { Rejection } from '../model/rejection.js';
import type { FixColumnName, LogFormat, Track, TrackRole, Waypoint } from '../model/track.js';

/** A log to read: its name (used in rejections and provenance) and its bytes or text. */
export interface LogInput {
  fileName: string;
  content: Uint8Array | string;
}

/** A column-map key: a fix column, or one of the helper columns a tabular log may have. */
export type ColumnKey =
  | FixColumnName
  | 'date'
  | 'time'
  | 'easting'
  | 'northing'
  | 'surfaceEasting'
  | 'surfaceNorthing'
  | 'elevationM';

/** How a reader should interpret a log; every field is optional and overrides detection. */
export interface ReadOptions {
  /** Read with this reader instead of detecting the format from the content. */
  format?: LogFormat;
  /** Explicit column map for tabular logs: header name, or 1-based column index as a string. */
  columns?: Partial<Record<ColumnKey, string>>;
  /** IANA time zone of times written without an offset (default: UTC, with a note). */
  timeZone?: string;
  /** CRS of projected easting/northing input, e.g. `EPSG:25832`. */
  inputCrs?: string;
  /** Role of the tracks the log holds when the log does not say (default `vehicle`). */
  role?: TrackRole;
}

/** One source column of a tabular log and what it was mapped to. */
export interface ColumnReportEntry {
  /** 1-based column index. */
  index: number;
  /** Header text, or `column N` when the log has no header. */
  header: string;
  /** The column key it feeds, or `unused`. */
  target: ColumnKey | 'unused';
  /** 0..1: 1 for an explicit option, about 0.9 for a known name, lower for a guess from content. */
  confidence: number;
  /** How the mapping was decided. */
  how: 'option' | 'name' | 'content' | 'none';
  /** The unit or form read from the header or the cells (e.g. `ft`, `epoch-ms`, `ddm`). */
  form?: string;
}

/** Everything one log held, normalised, plus what could not be read. */
export interface LogReadResult {
  format: LogFormat;
  /** The detected variant, e.g. `gpx-1.1`, `csv;delimiter=semicolon;decimal-comma`. */
  dialect: string;
  tracks: Track[];
  waypoints: Waypoint[];
  rejections: Rejection[];
  /** Source rows seen (data lines, sentences, points; a file refused as a whole counts as one). */
  rowCount: number;
  /** Rows deliberately neither fix nor rejection (header, comments, NMEA sentences merged into a fix). */
  nonFixRowCount: number;
  /** Human sentences: validation messages with line numbers, mapping confidence, depth-sign decisions. */
  notes: string[];
  /** For tabular logs: the column mapping with its confidence. */
  columnReport?: ColumnReportEntry[];
}
