import { convertToWgs84 } from '../crs/convert-to-wgs84.js';
import type { RejectionCode } from '../model/rejection.js';
import type { DepthSignDecision, Fix, FixColumnName, TrackRole } from '../model/track.js';
import {
  type LengthUnit,
  normaliseAzimuthDeg,
  parseLengthUnit,
  parseSpeedUnit,
  type SpeedUnit,
  toMetres,
  toMetresPerSecond,
} from '../model/units.js';
import { collectReadEvents } from './collect-read-events.js';
import { decodeLogText } from './decode-log-text.js';
import type { ColumnReportEntry, LogInput, LogReadResult, ReadOptions } from './log-read-result.js';
import { type CsvColumnMap, type MappedColumn, mapCsvColumns } from './map-csv-columns.js';
import { parseCoordinate } from './parse-coordinate.js';
import { FastCsvRowReader } from './parse-csv-row-fast.js';
import { LogTimeParser, type ParsedTime } from './parse-log-time.js';
import { projectRowsToWgs84 } from './project-rows.js';
import type { ReadEvent } from './read-event.js';
import { type LogLine, LogLineCursor, pullLogLines } from './split-log-lines.js';

/** Lines looked at to detect the delimiter, the header and the column mapping. */
const SAMPLE_LINES = 64;
const DELIMITERS = ['\t', ';', '|', ','] as const;
const DELIMITER_NAMES: Record<string, string> = { '\t': 'tab', ';': 'semicolon', '|': 'pipe', ',': 'comma' };

/** A text log given in chunks (one chunk is fine), for streaming in bounded memory. */
export interface LogTextInput {
  fileName: string;
  chunks: Iterable<string>;
}

/** What the CSV reader found out about a log's layout; filled in as the events are read. */
export interface CsvLayout {
  delimiter: string;
  decimalComma: boolean;
  hasHeader: boolean;
  map?: CsvColumnMap;
}

/**
 * Streams a CSV/TSV log as read events: detects the delimiter (tab, semicolon, pipe, comma),
 * decimal comma and header, maps columns (see `mapCsvColumns`), then reads every data line into a
 * fix or a rejection (`wrong-field-count`, `missing-value`, `unparsable-number`,
 * `unparsable-coordinate`, `unparsable-time`, `latitude-out-of-range`, `longitude-out-of-range`,
 * `time-out-of-range`, `non-finite-value`, `no-date`, `line-too-long`, `projection-failed`).
 * Depth comes from a depth column (positive down) or a negated elevation column. Surface-position
 * columns fill the vehicle's `surface*` columns; a log holding only surface positions is a
 * surface track. Fills `layout` as it goes.
 */
export function* readCsvEvents(
  input: LogTextInput,
  options: ReadOptions = {},
  layout?: CsvLayout,
): Generator<ReadEvent> {
  const file = input.fileName;
  const times = new LogTimeParser(options.timeZone ?? 'UTC');
  const pullLine = pullLogLines(input.chunks, { joinQuoted: true });
  // 1. gather a sample (copied: the line cursor is reused)
  const head: LogLine[] = [];
  let contentLines = 0;
  // pull the sample by hand: breaking out of a for-of would close the line generator
  for (let c = pullLine(); c !== undefined; c = contentLines >= SAMPLE_LINES ? undefined : pullLine()) {
    const copy: LogLine =
      c.tooLongChars >= 0 ? { text: '', line: c.line, tooLongChars: c.tooLongChars } : { text: c.text, line: c.line };
    head.push(copy);
    if (copy.text.trim() !== '' && !isComment(copy.text)) contentLines++;
  }
  const content = head.filter((l) => l.tooLongChars === undefined && l.text.trim() !== '' && !isComment(l.text));
  const delimiter = detectDelimiter(content.map((l) => l.text));
  const firstCells = content[0] === undefined ? [] : splitCsvRecord(content[0].text, delimiter);
  const hasHeader = firstCells.length > 0 && firstCells.every((c) => !/^\s*"?\s*[+-]?[\d.]/.test(c));
  const dataSample = (hasHeader ? content.slice(1) : content).map((l) => splitCsvRecord(l.text, delimiter));
  const width = hasHeader ? firstCells.length : Math.max(0, ...dataSample.map((r) => r.length));
  const decimalComma = delimiter !== ',' && dataSample.some((row) => row.some((c) => /^\s*[+-]?\d+,\d+\s*$/.test(c)));
  const map = mapCsvColumns(hasHeader ? firstCells : undefined, dataSample, width, options.columns, decimalComma);
  if (layout !== undefined) Object.assign(layout, { delimiter, decimalComma, hasHeader, map });
  const cols = map.columns;
  const projected = cols.latDeg === undefined && cols.easting !== undefined && cols.northing !== undefined;
  // surface-unit easting/northing beside the vehicle's position fill the surface* columns
  const surfaceProjected =
    cols.surfaceLatDeg === undefined && cols.surfaceEasting !== undefined && cols.surfaceNorthing !== undefined;
  const buffered = projected || (surfaceProjected && options.inputCrs !== undefined);
  // A file named as the surface unit's log is one, unless its columns tell vehicle and surface apart.
  const hasSurfaceColumns =
    cols.surfaceLatDeg !== undefined ||
    cols.surfaceLonDeg !== undefined ||
    cols.surfaceEasting !== undefined ||
    cols.surfaceNorthing !== undefined;
  const namedSurface = !hasSurfaceColumns && /(^|[^a-z])(surface|ship|vessel|boat)([^a-z]|$)/i.test(baseName(file));
  const role: TrackRole = options.role ?? (map.surfaceOnly || namedSurface ? 'surface' : 'vehicle');
  const dialect = [
    'csv',
    `delimiter=${DELIMITER_NAMES[delimiter] ?? delimiter}`,
    ...(decimalComma ? ['decimal-comma'] : []),
    ...(hasHeader ? [] : ['no-header']),
    ...(projected ? ['projected'] : []),
  ].join(';');
  const columnMapping: Partial<Record<FixColumnName, string>> = {};
  for (const entry of map.report) {
    if (entry.target !== 'unused') columnMapping[entry.target as FixColumnName] = entry.header;
  }
  yield {
    kind: 'track',
    role,
    provenance: {
      columnMapping,
      ...(projected && options.inputCrs !== undefined ? { inputCrs: options.inputCrs } : {}),
      timeZone: times.zone,
    },
  };
  if (map.surfaceOnly && options.role === undefined)
    yield { kind: 'note', text: 'only surface-unit positions found: read as a surface track' };
  for (const note of map.notes) yield { kind: 'note', text: note };
  let rowCount = 0;
  let depthCount = 0;
  let negativeDepthCount = 0;
  // what is missing makes every row a rejection; say so once and per row
  const missingPosition =
    cols.latDeg === undefined || cols.lonDeg === undefined
      ? projected
        ? undefined
        : 'latitude and longitude columns'
      : undefined;
  const missingTime = cols.timeMs === undefined && cols.time === undefined ? 'a time column' : undefined;
  if (missingPosition !== undefined)
    yield { kind: 'note', text: `no ${missingPosition} found: every row is rejected; pass a column map` };
  if (missingTime !== undefined)
    yield { kind: 'note', text: 'no time column found: every row is rejected; pass a column map' };
  if (projected && options.inputCrs === undefined)
    yield {
      kind: 'note',
      text: 'easting/northing columns need an input CRS (inputCrs / --input-crs): every row is rejected',
    };
  if (surfaceProjected && !projected && options.inputCrs === undefined)
    yield {
      kind: 'note',
      text: 'surface easting/northing columns need an input CRS (inputCrs / --input-crs): the surface position is left empty',
    };
  if ((projected || surfaceProjected) && options.inputCrs !== undefined) {
    // an unknown CRS is the caller's mistake: fail before reading rows (InvalidArgumentError)
    const probe = projectRowsToWgs84(options.inputCrs, []);
    yield { kind: 'note', text: `easting/northing read in ${options.inputCrs}: ${probe.method}` };
  }
  const elevation = cols.depthM === undefined ? cols.elevationM : undefined;
  const reject = (line: number, code: RejectionCode, expected: string, found: string, column?: number): ReadEvent => ({
    kind: 'rejection',
    rejection:
      column === undefined ? { file, line, code, expected, found } : { file, line, column, code, expected, found },
  });
  const projectedBuffer: { fix: Fix; line: number; x: number; y: number; sx: number; sy: number }[] = [];
  const flushProjected = function* (): Generator<ReadEvent> {
    if (projectedBuffer.length === 0) return;
    const crs = options.inputCrs ?? '';
    const outcome = projected
      ? projectRowsToWgs84(crs, projectedBuffer)
      : { latDeg: new Float64Array(0), lonDeg: new Float64Array(0), method: '' };
    const surface = surfaceProjected
      ? projectRowsToWgs84(
          crs,
          projectedBuffer.map((r) => ({ x: r.sx, y: r.sy })),
        )
      : undefined;
    for (let k = 0; k < projectedBuffer.length; k++) {
      const row = projectedBuffer[k] as (typeof projectedBuffer)[number];
      if (surface !== undefined) {
        const sLat = surface.latDeg[k] ?? Number.NaN;
        const sLon = surface.lonDeg[k] ?? Number.NaN;
        if (Number.isFinite(sLat) && Number.isFinite(sLon) && Math.abs(sLat) <= 90 && Math.abs(sLon) <= 180) {
          row.fix.surfaceLatDeg = sLat;
          row.fix.surfaceLonDeg = sLon;
        } else if (Number.isFinite(row.sx) && Number.isFinite(row.sy)) {
          yield reject(
            row.line,
            'projection-failed',
            `surface easting/northing convertible from ${crs}`,
            `${row.sx}, ${row.sy}`,
          );
          continue;
        }
      }
      if (!projected) {
        yield { kind: 'fix', fix: row.fix, line: row.line };
        continue;
      }
      const lat = outcome.latDeg[k] ?? Number.NaN;
      const lon = outcome.lonDeg[k] ?? Number.NaN;
      if (!Number.isFinite(lat) || !Number.isFinite(lon) || Math.abs(lat) > 90 || Math.abs(lon) > 180) {
        yield reject(
          row.line,
          'projection-failed',
          `easting/northing convertible from ${options.inputCrs}${outcome.error === undefined ? '' : ` (${outcome.error})`}`,
          `${row.x}, ${row.y}`,
        );
      } else {
        row.fix.latDeg = lat;
        row.fix.lonDeg = lon;
        yield { kind: 'fix', fix: row.fix, line: row.line };
      }
    }
    projectedBuffer.length = 0;
  };
  let headerSeen = !hasHeader;
  const fast =
    (buffered && options.inputCrs === undefined) || missingTime !== undefined || missingPosition !== undefined
      ? undefined
      : FastCsvRowReader.create(map, delimiter, decimalComma, width, times, {
          vehicle: projected,
          surface: buffered && surfaceProjected,
        });
  // Projected rows wait in the fast reader's batch (read there or by the general path below) until
  // it is full, as they waited in `projectedBuffer`, so rejections come out in the same order.
  const fastProjected = buffered && fast !== undefined;
  /** Converts the batch's easting/northing, then hands on its fixes and the rows that failed, in row order. */
  const flushFastProjected = function* (): Generator<ReadEvent> {
    const reader = fast as FastCsvRowReader;
    const xy = reader.projected as NonNullable<FastCsvRowReader['projected']>;
    const batch = reader.batch;
    const n = batch.count;
    if (n === 0) return;
    const crs = options.inputCrs ?? '';
    const vehicle = projected ? convertToWgs84(crs, xy.x.subarray(0, n), xy.y.subarray(0, n)) : undefined;
    const surface = surfaceProjected ? convertToWgs84(crs, xy.sx.subarray(0, n), xy.sy.subarray(0, n)) : undefined;
    const columns = batch.columns;
    let kept = 0;
    for (let k = 0; k < n; k++) {
      const line = batch.lines[k] as number;
      let failed: ReadEvent | undefined;
      if (surface !== undefined) {
        const sLat = surface.latDeg[k] ?? Number.NaN;
        const sLon = surface.lonDeg[k] ?? Number.NaN;
        const ok = Number.isFinite(sLat) && Number.isFinite(sLon) && Math.abs(sLat) <= 90 && Math.abs(sLon) <= 180;
        (columns.surfaceLatDeg as Float64Array)[k] = ok ? sLat : Number.NaN;
        (columns.surfaceLonDeg as Float64Array)[k] = ok ? sLon : Number.NaN;
        const sx = xy.sx[k] as number;
        const sy = xy.sy[k] as number;
        if (!ok && Number.isFinite(sx) && Number.isFinite(sy))
          failed = reject(
            line,
            'projection-failed',
            `surface easting/northing convertible from ${crs}`,
            `${sx}, ${sy}`,
          );
      }
      if (failed === undefined && vehicle !== undefined) {
        const lat = vehicle.latDeg[k] ?? Number.NaN;
        const lon = vehicle.lonDeg[k] ?? Number.NaN;
        if (!Number.isFinite(lat) || !Number.isFinite(lon) || Math.abs(lat) > 90 || Math.abs(lon) > 180)
          failed = reject(
            line,
            'projection-failed',
            `easting/northing convertible from ${crs}`,
            `${xy.x[k] as number}, ${xy.y[k] as number}`,
          );
        else {
          (columns.latDeg as Float64Array)[k] = lat;
          (columns.lonDeg as Float64Array)[k] = lon;
        }
      }
      if (failed === undefined) {
        reader.moveRow(k, kept++);
        continue;
      }
      // the fixes before a failed row go out before its rejection
      if (kept > 0) {
        batch.count = kept;
        yield { kind: 'fix-batch', batch };
        kept = 0;
      }
      yield failed;
    }
    batch.count = kept;
    if (kept > 0) yield { kind: 'fix-batch', batch };
    reader.reset();
  };
  // the sample lines first, then the rest; a plain function rather than a generator around the
  // line generator (one generator step per line instead of two)
  const headCursor = new LogLineCursor();
  let headAt = 0;
  const nextLine = (): LogLineCursor | undefined => {
    const l = head[headAt];
    if (l !== undefined) {
      headAt++;
      headCursor.source = l.text;
      headCursor.start = 0;
      headCursor.end = l.text.length;
      headCursor.line = l.line;
      headCursor.tooLongChars = l.tooLongChars ?? -1;
      headCursor.quoteCount = l.text.indexOf('"') < 0 ? 0 : 1;
      return headCursor;
    }
    return pullLine();
  };
  for (let c = nextLine(); c !== undefined; c = nextLine()) {
    const line = c.line;
    if (c.tooLongChars >= 0) {
      rowCount++;
      yield reject(line, 'line-too-long', `a line of at most 65536 characters`, `${c.tooLongChars} characters`);
      continue;
    }
    const src = c.source;
    const start = c.start;
    const end = c.end;
    if (start === end) continue; // blank lines are not rows
    const first = src.charCodeAt(start);
    let text: string | undefined;
    if (first <= 32) {
      text = src.slice(start, end);
      if (text.trim() === '') continue;
    }
    rowCount++;
    if (first === 35 || first === 47 || first <= 32) {
      text ??= src.slice(start, end);
      if (isComment(text)) {
        yield { kind: 'non-fix-row', line, why: 'comment' };
        continue;
      }
    }
    if (!headerSeen) {
      headerSeen = true;
      yield { kind: 'non-fix-row', line, why: 'header' };
      continue;
    }
    if (fast !== undefined) {
      if (fast.read(src, start, end, line, c.quoteCount !== 0)) {
        if (fast.full) {
          if (fastProjected) yield* flushFastProjected();
          else {
            yield { kind: 'fix-batch', batch: fast.batch };
            fast.reset();
          }
        }
        continue;
      }
      // the general path keeps the order of rows: hand on what the fast path gathered first
      // (projected rows wait for their conversion, as they did in `projectedBuffer`)
      if (!fastProjected && fast.batch.count > 0) {
        yield { kind: 'fix-batch', batch: fast.batch };
        fast.reset();
      }
    }
    text ??= src.slice(start, end);
    const cells = splitCsvRecord(text, delimiter);
    if (cells.length !== width && !(cells.length === width + 1 && (cells[width] ?? '').trim() === '')) {
      yield reject(
        line,
        'wrong-field-count',
        `${width} fields separated by ${DELIMITER_NAMES[delimiter] ?? delimiter}`,
        `${cells.length} fields`,
      );
      continue;
    }
    if (missingTime !== undefined) {
      yield reject(line, 'missing-value', missingTime, 'no column mapped to time');
      continue;
    }
    if (missingPosition !== undefined) {
      yield reject(line, 'missing-value', missingPosition, 'no columns mapped to position');
      continue;
    }
    // time
    let time: ParsedTime;
    let timeColumn: MappedColumn;
    if (cols.timeMs !== undefined) {
      timeColumn = cols.timeMs;
      const cell = cells[timeColumn.index] ?? '';
      if (cell.trim() === '') {
        yield reject(line, 'missing-value', 'a time', 'an empty cell', timeColumn.index + 1);
        continue;
      }
      time =
        timeColumn.timeForm === 'epoch-s' || timeColumn.timeForm === 'epoch-ms'
          ? times.parseEpoch(cell, timeColumn.timeForm === 'epoch-s' ? 's' : 'ms')
          : times.parseDateTime(cell);
      if (!time.ok && timeColumn.timeForm === 'datetime' && cols.date !== undefined)
        time = times.parseDateAndTime(cells[cols.date.index] ?? '', cell);
    } else {
      timeColumn = cols.time as MappedColumn;
      const cell = cells[timeColumn.index] ?? '';
      if (cols.date === undefined) {
        yield reject(line, 'no-date', 'a date column beside the time-of-day column', cell, timeColumn.index + 1);
        continue;
      }
      time = times.parseDateAndTime(cells[cols.date.index] ?? '', cell);
    }
    if (!time.ok) {
      yield reject(line, time.code, time.expected, quote(cells[timeColumn.index] ?? ''), timeColumn.index + 1);
      continue;
    }
    const fix: Fix = { timeMs: time.timeMs, latDeg: Number.NaN, lonDeg: Number.NaN };
    let failed: ReadEvent | undefined;
    let x = Number.NaN;
    let y = Number.NaN;
    if (projected) {
      const e = cols.easting as MappedColumn;
      const nn = cols.northing as MappedColumn;
      x = readNumberCell(cells[e.index] ?? '', decimalComma, e.lengthUnit);
      y = readNumberCell(cells[nn.index] ?? '', decimalComma, nn.lengthUnit);
      if (!Number.isFinite(x) || !Number.isFinite(y)) {
        const bad = !Number.isFinite(x) ? e : nn;
        yield reject(
          line,
          'unparsable-number',
          'a projected coordinate in metres',
          quote(cells[bad.index] ?? ''),
          bad.index + 1,
        );
        continue;
      }
      if (options.inputCrs === undefined) {
        yield reject(
          line,
          'projection-failed',
          'an input CRS for easting/northing (inputCrs / --input-crs)',
          'none given',
        );
        continue;
      }
    } else {
      for (const [key, axis] of [
        ['latDeg', 'lat'],
        ['lonDeg', 'lon'],
      ] as const) {
        const column = cols[key] as MappedColumn;
        const cell = cells[column.index] ?? '';
        if (cell.trim() === '') {
          failed = reject(
            line,
            'missing-value',
            axis === 'lat' ? 'a latitude' : 'a longitude',
            'an empty cell',
            column.index + 1,
          );
          break;
        }
        const parsed = parseCoordinate(cell, axis);
        if (!parsed.ok) {
          failed = reject(line, parsed.code, parsed.expected, quote(cell), column.index + 1);
          break;
        }
        fix[key] = parsed.deg;
      }
      if (failed !== undefined) {
        yield failed;
        continue;
      }
    }
    for (const [key, axis] of [
      ['surfaceLatDeg', 'lat'],
      ['surfaceLonDeg', 'lon'],
    ] as const) {
      const column = cols[key];
      if (column === undefined) continue;
      const cell = cells[column.index] ?? '';
      if (cell.trim() === '') continue; // an optional value may be missing
      const parsed = parseCoordinate(cell, axis);
      if (!parsed.ok) {
        failed = reject(line, parsed.code, parsed.expected, quote(cell), column.index + 1);
        break;
      }
      fix[key] = parsed.deg;
    }
    if (failed !== undefined) {
      yield failed;
      continue;
    }
    for (const key of OPTIONAL_NUMBERS) {
      const column = cols[key];
      if (column === undefined) continue;
      const cell = cells[column.index] ?? '';
      if (cell.trim() === '') continue;
      let value = readNumberCell(cell, decimalComma, column.lengthUnit, column.speedUnit, key);
      if (Number.isNaN(value)) {
        const nonFinite = /^\s*[+-]?(nan|inf(inity)?)\s*$/i.test(cell);
        failed = reject(
          line,
          nonFinite ? 'non-finite-value' : 'unparsable-number',
          `a number${UNIT_WORD[key] ?? ''}`,
          quote(cell),
          column.index + 1,
        );
        break;
      }
      if (key === 'elevationM') {
        fix.depthM = -value + 0;
        continue;
      }
      if (key === 'headingDeg' || key === 'bearingDeg' || key === 'surfaceHeadingDeg')
        value = normaliseAzimuthDeg(value);
      fix[key] = value;
    }
    if (failed !== undefined) {
      yield failed;
      continue;
    }
    const depth = fix.depthM;
    if (depth !== undefined && !Number.isNaN(depth)) {
      depthCount++;
      if (depth < 0) negativeDepthCount++;
    }
    if (buffered) {
      let sx = Number.NaN;
      let sy = Number.NaN;
      if (surfaceProjected) {
        const se = cols.surfaceEasting as MappedColumn;
        const sn = cols.surfaceNorthing as MappedColumn;
        const eCell = cells[se.index] ?? '';
        const nCell = cells[sn.index] ?? '';
        if (eCell.trim() !== '' || nCell.trim() !== '') {
          sx = readNumberCell(eCell, decimalComma, se.lengthUnit);
          sy = readNumberCell(nCell, decimalComma, sn.lengthUnit);
          if (!Number.isFinite(sx) || !Number.isFinite(sy)) {
            const bad = !Number.isFinite(sx) ? se : sn;
            yield reject(
              line,
              'unparsable-number',
              'a projected surface coordinate in metres',
              quote(cells[bad.index] ?? ''),
              bad.index + 1,
            );
            continue;
          }
        }
      }
      if (fastProjected) {
        (fast as FastCsvRowReader).appendFix(fix, line, x, y, sx, sy);
        if ((fast as FastCsvRowReader).full) yield* flushFastProjected();
        continue;
      }
      projectedBuffer.push({ fix, line, x, y, sx, sy });
      if (projectedBuffer.length >= 4096) yield* flushProjected();
      continue;
    }
    yield { kind: 'fix', fix, line };
  }
  yield* flushProjected();
  if (fastProjected) yield* flushFastProjected();
  if (fast !== undefined && fast.batch.count > 0) {
    yield { kind: 'fix-batch', batch: fast.batch };
    fast.reset();
  }
  if (fast !== undefined) {
    depthCount += fast.depthCount;
    negativeDepthCount += fast.negativeDepthCount;
  }
  if (times.sawZonelessTimeAsUtc)
    yield { kind: 'note', text: 'times without a UTC offset were read as UTC (no time zone given)' };
  if (times.sawAmbiguousLocalTime)
    yield {
      kind: 'note',
      text: `local times in the hour the clocks go back (${times.zone}) were read so that time keeps moving forward`,
    };
  yield {
    kind: 'depth-sign',
    decision: decideCsvDepthSign(
      cols.depthM !== undefined,
      elevation !== undefined,
      depthCount,
      negativeDepthCount,
      role,
    ),
  };
  yield { kind: 'end', rowCount, dialect };
}

/** Reads a whole CSV/TSV log (bytes or text) into tracks, waypoints and rejections; see `readCsvEvents`. */
export function readCsv(input: LogInput, options: ReadOptions = {}): LogReadResult {
  const decoded = decodeLogText(input.fileName, input.content);
  if (!decoded.ok) return refusedLog('csv', decoded.rejection);
  const layout: CsvLayout = { delimiter: ',', decimalComma: false, hasHeader: false };
  const events = readCsvEvents({ fileName: input.fileName, chunks: [decoded.text] }, options, layout);
  const result = collectReadEvents(events, {
    fileName: input.fileName,
    format: 'csv',
    timeZone: options.timeZone ?? 'UTC',
    columnReport: (): ColumnReportEntry[] | undefined => layout.map?.report,
  });
  if (decoded.encoding !== 'utf-8') result.notes.unshift(`decoded as ${decoded.encoding.toUpperCase()}`);
  return result;
}

/** A result for a log refused as a whole: no tracks, one rejection, one row. */
export function refusedLog(
  format: LogReadResult['format'],
  rejection: LogReadResult['rejections'][number],
): LogReadResult {
  return {
    format,
    dialect: format,
    tracks: [],
    waypoints: [],
    rejections: [rejection],
    rowCount: 1,
    nonFixRowCount: 0,
    notes: [],
  };
}

const OPTIONAL_NUMBERS = [
  'depthM',
  'elevationM',
  'headingDeg',
  'speedMps',
  'quality',
  'slantRangeM',
  'bearingDeg',
  'surfaceHeadingDeg',
] as const;
const UNIT_WORD: Partial<Record<(typeof OPTIONAL_NUMBERS)[number], string>> = {
  depthM: ' (metres, or with a length unit)',
  elevationM: ' (metres, or with a length unit)',
  slantRangeM: ' (metres, or with a length unit)',
  speedMps: ' (m/s, or with a speed unit)',
  headingDeg: ' (degrees)',
  bearingDeg: ' (degrees)',
  surfaceHeadingDeg: ' (degrees)',
};
const LENGTH_KEYS = new Set(['depthM', 'elevationM', 'slantRangeM']);

/**
 * Reads a numeric cell: a plain number, a decimal comma when the log uses one, and an optional
 * unit after the number (`12.5 m`, `41ft`, `270°`, `3 kn`) converted through `model/units`.
 * `NaN` when it is not a finite number or the unit does not fit the quantity.
 */
export function readNumberCell(
  cell: string,
  decimalComma: boolean,
  lengthUnit?: LengthUnit,
  speedUnit?: SpeedUnit,
  key?: string,
): number {
  const text = decimalComma ? cell.replace(',', '.') : cell;
  let value = Number(text);
  let cellLength: LengthUnit | undefined;
  let cellSpeed: SpeedUnit | undefined;
  if (Number.isNaN(value) || text.trim() === '') {
    const m = /^\s*([+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?)\s*([^\d\s].*?)\s*$/.exec(text);
    if (m === null) return Number.NaN;
    value = Number(m[1]);
    const unit = m[2] as string;
    if (unit === '°' || /^deg(rees)?$/i.test(unit)) {
      if (key !== undefined && !['headingDeg', 'bearingDeg', 'surfaceHeadingDeg'].includes(key)) return Number.NaN;
    } else {
      cellLength = parseLengthUnit(unit);
      cellSpeed = parseSpeedUnit(unit);
      if (key !== undefined && LENGTH_KEYS.has(key) && cellLength === undefined) return Number.NaN;
      if (key === 'speedMps' && cellSpeed === undefined) return Number.NaN;
      if (key !== undefined && !LENGTH_KEYS.has(key) && key !== 'speedMps') return Number.NaN;
      if (key === undefined && cellLength === undefined) return Number.NaN;
    }
  }
  if (!Number.isFinite(value)) return Number.NaN;
  const lu = cellLength ?? lengthUnit;
  if (lu !== undefined && lu !== 'm' && (key === undefined || LENGTH_KEYS.has(key))) value = toMetres(value, lu);
  const su = cellSpeed ?? speedUnit;
  if (su !== undefined && su !== 'mps' && key === 'speedMps') value = toMetresPerSecond(value, su);
  return value;
}

function decideCsvDepthSign(
  hasDepth: boolean,
  hasElevation: boolean,
  count: number,
  negative: number,
  role: TrackRole,
): DepthSignDecision {
  if (hasDepth) {
    if (count > 0 && negative === count && role === 'vehicle') {
      return {
        rule: 'depth',
        doubtful: true,
        reason:
          'the depth column is negative in every row: it may hold elevations; kept as given (positive down), check the log',
      };
    }
    return { rule: 'depth', doubtful: false, reason: 'the log has a depth column, read as metres positive down' };
  }
  if (hasElevation) {
    if (count > 0 && negative === count && role === 'vehicle') {
      return {
        rule: 'negated-elevation',
        doubtful: true,
        reason:
          'the elevation column is positive in every row although this is a vehicle track: depth = -elevation is above the surface; check the log',
      };
    }
    return {
      rule: 'negated-elevation',
      doubtful: false,
      reason: 'the log has an elevation column; depth = -elevation',
    };
  }
  return { rule: 'none', doubtful: false, reason: 'the log has no depth or elevation column' };
}

/** Picks the delimiter whose count is the same (and non-zero) on most sample lines; tab, semicolon and pipe win over comma, which may be a decimal mark. */
export function detectDelimiter(lines: readonly string[]): string {
  let best = ',';
  let bestScore = 0;
  for (const delimiter of DELIMITERS) {
    const counts = lines.map((l) => splitCsvRecord(l, delimiter).length - 1);
    if (counts.length === 0) continue;
    const freq = new Map<number, number>();
    for (const c of counts) if (c > 0) freq.set(c, (freq.get(c) ?? 0) + 1);
    let modeCount = 0;
    for (const v of freq.values()) modeCount = Math.max(modeCount, v);
    const score = modeCount / counts.length;
    if (score >= 0.8 && score > bestScore + 1e-9) {
      best = delimiter;
      bestScore = score;
    }
  }
  return best;
}

/** Splits one CSV record into fields, RFC 4180 quoting (`"a,b"`, `""` for a quote) included. */
export function splitCsvRecord(text: string, delimiter: string): string[] {
  if (text.indexOf('"') < 0) return text.split(delimiter);
  const out: string[] = [];
  const n = text.length;
  let i = 0;
  for (;;) {
    // leading white space before an opening quote is tolerated
    let j = i;
    while (j < n && text.charCodeAt(j) === 32) j++;
    if (text.charCodeAt(j) === 34) {
      let value = '';
      i = j + 1;
      for (;;) {
        const q = text.indexOf('"', i);
        if (q < 0) {
          value += text.slice(i);
          i = n;
          break;
        }
        value += text.slice(i, q);
        if (text.charCodeAt(q + 1) === 34) {
          value += '"';
          i = q + 2;
        } else {
          i = q + 1;
          break;
        }
      }
      const d = text.indexOf(delimiter, i);
      if (d < 0) {
        out.push(value + text.slice(i).trim());
        return out;
      }
      out.push(value + text.slice(i, d).trim());
      i = d + 1;
    } else {
      const d = text.indexOf(delimiter, i);
      if (d < 0) {
        out.push(text.slice(i));
        return out;
      }
      out.push(text.slice(i, d));
      i = d + 1;
    }
  }
}

function isComment(text: string): boolean {
  const t = text.trimStart();
  return t.startsWith('#') || t.startsWith('//');
}

function quote(cell: string): string {
  const t = cell.length > 60 ? `${cell.slice(0, 57)}...` : cell;
  return `"${t}"`;
}

function baseName(file: string): string {
  const at = Math.max(file.lastIndexOf('/'), file.lastIndexOf('\\'));
  return file.slice(at + 1);
}
