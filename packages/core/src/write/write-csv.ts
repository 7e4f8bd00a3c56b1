import { createReprojection } from '../crs/create-reprojection.js';
import type { ResolvedCrs } from '../crs/resolve-crs.js';
import { type FixColumnName, hasColumnValues } from '../model/track.js';
import { formatDecimal, formatIsoTime } from './format-decimal.js';
import { SHORTEST_DIGITS, TextBuffer } from './text-buffer.js';
import { segmentRanges, type WriteInput } from './write-input.js';

/** Options of `writeCsv`. */
export interface WriteCsvOptions {
  /** Also start a new segment where consecutive fixes are more than this many ms apart (loss of reception). */
  gapMs?: number;
  /**
   * Also write coordinates in this CRS (from `resolveCrs`, or `chooseUtmZone` then `resolveCrs`):
   * `easting_m`/`northing_m` for a projected CRS in metres, `easting_<unit>`/`northing_<unit>`
   * otherwise, `crs_lon_deg`/`crs_lat_deg` for a geographic one. `lat`/`lon` (WGS 84) are always kept.
   */
  crs?: ResolvedCrs;
  /**
   * Decimal places of WGS 84 degrees (`lat`, `lon`, `surface_lat`, `surface_lon`; default 8, about
   * 1 mm) and of projected coordinates (default 3).
   */
  degreeDecimals?: number;
  projectedDecimals?: number;
  /** Field separator; default `,` (RFC 4180). */
  separator?: ',' | ';' | '\t';
}

const OPTIONAL_COLUMNS: ReadonlyArray<readonly [FixColumnName, string]> = [
  ['depthM', 'depth_m'],
  ['headingDeg', 'heading_deg'],
  ['speedMps', 'speed_mps'],
  ['quality', 'quality'],
  ['slantRangeM', 'slant_range_m'],
  ['bearingDeg', 'bearing_deg'],
  ['surfaceLatDeg', 'surface_lat'],
  ['surfaceLonDeg', 'surface_lon'],
  ['surfaceHeadingDeg', 'surface_heading_deg'],
];

/** Optional columns in WGS 84 degrees, rounded like `lat`/`lon`. */
const DEGREE_COLUMNS: ReadonlySet<FixColumnName> = new Set(['surfaceLatDeg', 'surfaceLonDeg']);

/** Logged values rarely carry more than three decimals (a guess that speeds the digits up, never changes them). */
const LIKELY_DECIMALS = 3;

/** Quotes a field per RFC 4180 §2 when it holds the separator, a quote, CR or LF. */
function quote(field: string, separator: string): string {
  if (field.includes(separator) || /["\r\n]/.test(field)) return `"${field.replace(/"/g, '""')}"`;
  return field;
}

function unitSuffix(unit: string): string {
  if (/^met(re|er)$/i.test(unit)) return 'm';
  if (/us survey foot/i.test(unit)) return 'us_ft';
  if (/foot/i.test(unit)) return 'ft';
  return unit.toLowerCase().replace(/[^a-z0-9]+/g, '_');
}

/**
 * Writes tracks and waypoints as one CSV table (RFC 4180: CRLF line ends, quoted fields where
 * needed) with the unit in every header name: `track`, `role`, `segment`, `name`, `time` (ISO 8601
 * UTC), `lat`, `lon` (WGS 84 degrees), the CRS coordinates when `crs` is given, then `depth_m` and
 * the other per-fix columns that hold a value in any track. Waypoints follow as rows with role
 * `waypoint`. A value that is missing or cannot be projected is an empty field, never `NaN`.
 */
export function writeCsv(input: WriteInput, options: WriteCsvOptions = {}): string {
  return buildCsv(input, options).toString();
}

/**
 * `writeCsv`'s text as UTF-8 bytes, built as bytes from the start: for a caller that writes a file,
 * it saves turning millions of rows into a string and back.
 */
export function writeCsvBytes(input: WriteInput, options: WriteCsvOptions = {}): Uint8Array {
  return buildCsv(input, options).toBytes();
}

function buildCsv(input: WriteInput, options: WriteCsvOptions): TextBuffer {
  const sep = options.separator ?? ',';
  const degDecimals = options.degreeDecimals ?? 8;
  const projDecimals = options.projectedDecimals ?? 3;
  const crs = options.crs;
  const reprojection = crs ? createReprojection(crs) : undefined;
  const crsHeaders: string[] = !crs
    ? []
    : crs.kind === 'geographic'
      ? ['crs_lon_deg', 'crs_lat_deg']
      : [`easting_${unitSuffix(crs.unit)}`, `northing_${unitSuffix(crs.unit)}`];
  const crsDecimals = crs?.kind === 'geographic' ? degDecimals : projDecimals;
  const used = OPTIONAL_COLUMNS.filter(([column]) => input.tracks.some((t) => hasColumnValues(t.columns[column])));
  const hasWaypointDepth = input.waypoints.some((w) => Number.isFinite(w.depthM));
  const columns = [...used];
  if (hasWaypointDepth && !columns.some(([c]) => c === 'depthM')) columns.unshift(['depthM', 'depth_m']);
  const header = [
    'track',
    'role',
    'segment',
    'name',
    'time',
    'lat',
    'lon',
    ...crsHeaders,
    ...columns.map(([, h]) => h),
  ];
  // Rows go straight into one byte buffer: a million fixes make tens of millions of fields, and a
  // string per field (joined per row, then per file) costs more than formatting the numbers.
  const out = new TextBuffer();
  out.text(`${header.map((h) => quote(h, sep)).join(sep)}\r\n`);
  const sepCode = sep.charCodeAt(0);
  const headerBytes = out.byteLength;
  let rowsWritten = 0;
  for (const track of input.tracks) {
    const c = track.columns;
    const projected = reprojection?.forward(c.lonDeg, c.latDeg);
    const ranges = segmentRanges(track, options.gapMs);
    // Numbers never need quoting (digits, '-', '.'); the track's own fields are quoted once.
    const trackFields = `${quote(track.id, sep)}${sep}${quote(track.role, sep)}${sep}`;
    const nameField = `${sep}${quote(track.name ?? '', sep)}${sep}`;
    // The numeric columns after the time, each with its decimals worked out once: lat/lon, the CRS
    // coordinates and the surface unit's degrees are rounded to fixed decimals, other values
    // written in their shortest form.
    const values: Float64Array[] = [c.latDeg, c.lonDeg];
    const decimals: number[] = [degDecimals, degDecimals];
    if (projected) {
      values.push(projected.x, projected.y);
      decimals.push(crsDecimals, crsDecimals);
    }
    for (const [column] of columns) {
      values.push(c[column]);
      decimals.push(DEGREE_COLUMNS.has(column) ? degDecimals : SHORTEST_DIGITS);
    }
    const timeMs = c.timeMs;
    for (let s = 0; s < ranges.length; s++) {
      const [start, end] = ranges[s] as [number, number];
      const segmentFields = TextBuffer.encode(`${trackFields}${s + 1}${nameField}`);
      // Room for the whole segment at once, guessed from the rows so far (the first time from
      // typical field widths), so the buffer grows about once per file instead of doubling often.
      const rowBytes =
        rowsWritten > 0
          ? ((out.byteLength - headerBytes) / rowsWritten) * 1.125
          : segmentFields.length + 56 + 12 * values.length;
      out.makeRoom((end - start) * rowBytes);
      rowsWritten += end - start;
      for (let i = start; i < end; i++) {
        out.bytes(segmentFields);
        out.isoTime(timeMs[i] as number);
        out.separatedNumbers(sepCode, values, decimals, i, LIKELY_DECIMALS);
        out.char(13);
        out.char(10);
      }
    }
  }
  if (input.waypoints.length > 0) {
    const lat = Float64Array.from(input.waypoints, (w) => w.latDeg);
    const lon = Float64Array.from(input.waypoints, (w) => w.lonDeg);
    const projected = reprojection?.forward(lon, lat);
    input.waypoints.forEach((w, i) => {
      const fields = [
        '',
        'waypoint',
        '',
        w.name,
        formatIsoTime(w.timeMs),
        formatDecimal(w.latDeg, degDecimals),
        formatDecimal(w.lonDeg, degDecimals),
      ];
      if (projected)
        fields.push(
          formatDecimal(projected.x[i] as number, crsDecimals),
          formatDecimal(projected.y[i] as number, crsDecimals),
        );
      for (const [column] of columns) fields.push(column === 'depthM' ? formatDecimal(w.depthM) : '');
      out.text(`${fields.map((f) => quote(f, sep)).join(sep)}\r\n`);
    });
  }
  return out;
}
