import type { Fix, FixColumnName } from '../model/track.js';
import { normaliseAzimuthDeg, toMetres, toMetresPerSecond } from '../model/units.js';
import type { CsvColumnMap, MappedColumn } from './map-csv-columns.js';
import type { LogTimeParser } from './parse-log-time.js';
import type { FixBatch } from './read-event.js';

/** Rows gathered before a batch is handed on. */
export const FAST_BATCH_ROWS = 4096;

const KIND_IGNORE = 0;
const KIND_TIME_ISO = 1;
const KIND_TIME_S = 2;
const KIND_TIME_MS = 3;
const KIND_NUMBER = 4;
const KIND_LAT = 5;
const KIND_LON = 6;
const KIND_DATE = 7;
const KIND_TIME_OF_DAY = 8;
/** A projected coordinate (easting, northing), kept as read until the batch is converted. */
const KIND_PROJECTED = 9;

/** Days per month of a common year (February 29 is checked apart). */
const MONTH_DAYS = [31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];
/**
 * Milliseconds of a three-digit fraction of a second as the general path computes them for a time
 * of day (`Number("0.fff") * 1000`, not always an integer), so both paths give the same bits.
 */
const FRACTION_MS = Array.from({ length: 1000 }, (_, k) => Number(`0.${String(k).padStart(3, '0')}`) * 1000);

/** 1 for the kinds whose cells are read as a number first. */
const NUMERIC_KINDS = new Uint8Array(16);
for (const kind of [KIND_TIME_S, KIND_TIME_MS, KIND_NUMBER, KIND_LAT, KIND_LON, KIND_PROJECTED])
  NUMERIC_KINDS[kind] = 1;

/** Where the last `scanDecimal` stopped: the delimiter, the line's end, or the first character that is not part of a plain number. */
let scanStop = 0;

/**
 * `parseDecimal` of the characters from `start` up to the next `delimiter` (or `end`), found in the
 * same pass; `NaN` when another character comes first (`scanStop` then points at it).
 */
function scanDecimal(s: string, start: number, end: number, delimiter: number, decimalMark2: number): number {
  let i = start;
  let negative = false;
  const first = s.charCodeAt(i);
  if (first === 45 || first === 43) {
    negative = first === 45;
    i++;
  }
  // The whole part, then the fraction: two tight loops (no per-digit test of which part it is in).
  let mantissa = 0;
  let c = 0;
  const wholeStart = i;
  for (; i < end; i++) {
    c = s.charCodeAt(i);
    const d = c - 48;
    if (d < 0 || d > 9) break;
    mantissa = mantissa * 10 + d;
  }
  let digitCount = i - wholeStart;
  let fractionDigits = 0;
  if (i < end && (c === 46 || c === decimalMark2)) {
    const fractionStart = ++i;
    for (; i < end; i++) {
      c = s.charCodeAt(i);
      const d = c - 48;
      if (d < 0 || d > 9) break;
      mantissa = mantissa * 10 + d;
    }
    fractionDigits = i - fractionStart;
    digitCount += fractionDigits;
  }
  scanStop = i;
  if (i < end && c !== delimiter) return Number.NaN;
  if (digitCount === 0) return Number.NaN;
  if (digitCount > 15) return parseLongDecimal(s, start, i, decimalMark2);
  const value = fractionDigits > 0 ? mantissa / (POW10[fractionDigits] as number) : mantissa;
  return negative ? -value : value;
}

/** A number of more than 15 digits, left to `Number()` (the mantissa would not be exact). */
function parseLongDecimal(s: string, start: number, end: number, decimalMark2: number): number {
  const text = s.slice(start, end);
  const value = Number(decimalMark2 === 44 ? text.replace(',', '.') : text);
  return Number.isFinite(value) ? value : Number.NaN;
}

/** 10^k for k = 0..22, all exact in binary64. */
const POW10 = Array.from({ length: 23 }, (_, k) => 10 ** k);

/**
 * The hot path of the CSV reader for rows in the plain form (no quotes, decimal degrees, `Z`
 * ISO times or epoch numbers, plain numbers): fields are read in place by character codes without
 * copying. A row it cannot read with certainty is left to the general path, which reads it or
 * rejects it with a reason; so this path never rejects and never changes a result, it only skips work.
 */
export class FastCsvRowReader {
  readonly batch: FixBatch;
  depthCount = 0;
  negativeDepthCount = 0;
  readonly #delimiter: string;
  readonly #delimiterCode: number;
  readonly #decimalMark2: number;
  readonly #width: number;
  readonly #kinds: Int8Array;
  readonly #targets: (Float64Array | undefined)[];
  readonly #scales: Float64Array;
  readonly #wrap: Uint8Array;
  readonly #required: Uint8Array;
  #dateAndTime = false;
  readonly #times: LogTimeParser;
  #dayKey = -1;
  #dayMs = 0;
  /** Scratch of the row being read: its date (UTC ms of midnight) and time of day (ms, and whether it ended in `Z`). */
  #rowDayMs = Number.NaN;
  #rowTimeOfDayMs = Number.NaN;
  #rowTimeOfDayUtc = false;

  private constructor(delimiter: string, decimalComma: boolean, width: number, times: LogTimeParser) {
    this.#times = times;
    this.#delimiter = delimiter;
    this.#delimiterCode = delimiter.charCodeAt(0);
    this.#decimalMark2 = decimalComma ? 44 : 46;
    this.#width = width;
    this.#kinds = new Int8Array(width);
    this.#targets = new Array(width).fill(undefined);
    this.#scales = new Float64Array(width).fill(1);
    this.#wrap = new Uint8Array(width);
    this.#required = new Uint8Array(width);
    this.batch = { count: 0, lines: new Uint32Array(FAST_BATCH_ROWS), columns: {} };
  }

  /**
   * Easting and northing (vehicle and surface unit) of the rows in the batch when the layout has
   * projected coordinates, in the CRS's unit; `NaN` for a surface position left empty. The batch's
   * latitude and longitude columns are filled from them by the caller (`setProjected` rows).
   */
  projected: { x: Float64Array; y: Float64Array; sx: Float64Array; sy: Float64Array } | undefined;

  /**
   * A reader for this layout, or `undefined` when the layout needs the general path. Times go
   * through `times` as on the general path (zone, last time read). With `projected` (the
   * caller has an input CRS), easting/northing columns are read into `projected`.
   */
  static create(
    map: CsvColumnMap,
    delimiter: string,
    decimalComma: boolean,
    width: number,
    times: LogTimeParser,
    projected: { vehicle: boolean; surface: boolean } = { vehicle: false, surface: false },
  ): FastCsvRowReader | undefined {
    const c = map.columns;
    const metres = (m: MappedColumn | undefined) => m !== undefined && (m.lengthUnit ?? 'm') === 'm';
    if (projected.vehicle) {
      if (c.latDeg !== undefined || c.lonDeg !== undefined || !metres(c.easting) || !metres(c.northing))
        return undefined;
    } else if (c.latDeg === undefined || c.lonDeg === undefined) return undefined;
    if (
      projected.surface &&
      (c.surfaceLatDeg !== undefined ||
        c.surfaceLonDeg !== undefined ||
        !metres(c.surfaceEasting) ||
        !metres(c.surfaceNorthing))
    )
      return undefined;
    // one date-time column, or a date column beside a time-of-day column
    const dateAndTime = c.timeMs === undefined && c.date !== undefined && c.time?.timeForm === 'time-of-day';
    if (!dateAndTime && (c.timeMs === undefined || c.time !== undefined || c.date !== undefined)) return undefined;
    if (delimiter.length !== 1 || width > 256) return undefined;
    const reader = new FastCsvRowReader(delimiter, decimalComma, width, times);
    const column = (name: FixColumnName): Float64Array => {
      let array = reader.batch.columns[name];
      if (array === undefined) {
        array = new Float64Array(FAST_BATCH_ROWS);
        reader.batch.columns[name] = array;
      }
      return array;
    };
    if (c.timeMs !== undefined) {
      const form = c.timeMs.timeForm;
      reader.#kinds[c.timeMs.index] =
        form === 'epoch-s' ? KIND_TIME_S : form === 'epoch-ms' ? KIND_TIME_MS : KIND_TIME_ISO;
      reader.#targets[c.timeMs.index] = column('timeMs');
      reader.#required[c.timeMs.index] = 1;
    } else if (c.date !== undefined && c.time !== undefined) {
      reader.#dateAndTime = true;
      const timeMs = column('timeMs');
      reader.#kinds[c.date.index] = KIND_DATE;
      reader.#targets[c.date.index] = timeMs;
      reader.#required[c.date.index] = 1;
      reader.#kinds[c.time.index] = KIND_TIME_OF_DAY;
      reader.#targets[c.time.index] = timeMs;
      reader.#required[c.time.index] = 1;
    }
    if (projected.vehicle || projected.surface) {
      const scratch = () => new Float64Array(FAST_BATCH_ROWS).fill(Number.NaN);
      const xy = { x: scratch(), y: scratch(), sx: scratch(), sy: scratch() };
      reader.projected = xy;
      const read = (m: MappedColumn | undefined, target: Float64Array, required: boolean) => {
        if (m === undefined) return;
        reader.#kinds[m.index] = KIND_PROJECTED;
        reader.#targets[m.index] = target;
        reader.#required[m.index] = required ? 1 : 0;
      };
      if (projected.vehicle) {
        read(c.easting, xy.x, true);
        read(c.northing, xy.y, true);
        column('latDeg');
        column('lonDeg');
      }
      if (projected.surface) {
        read(c.surfaceEasting, xy.sx, false);
        read(c.surfaceNorthing, xy.sy, false);
        column('surfaceLatDeg');
        column('surfaceLonDeg');
      }
    }
    if (c.latDeg !== undefined && c.lonDeg !== undefined) {
      reader.#kinds[c.latDeg.index] = KIND_LAT;
      reader.#targets[c.latDeg.index] = column('latDeg');
      reader.#required[c.latDeg.index] = 1;
      reader.#kinds[c.lonDeg.index] = KIND_LON;
      reader.#targets[c.lonDeg.index] = column('lonDeg');
      reader.#required[c.lonDeg.index] = 1;
    }
    for (const [key, axis] of [
      ['surfaceLatDeg', KIND_LAT],
      ['surfaceLonDeg', KIND_LON],
    ] as const) {
      const mapped = c[key];
      if (mapped === undefined) continue;
      reader.#kinds[mapped.index] = axis;
      reader.#targets[mapped.index] = column(key);
    }
    for (const key of [
      'depthM',
      'elevationM',
      'headingDeg',
      'speedMps',
      'quality',
      'slantRangeM',
      'bearingDeg',
      'surfaceHeadingDeg',
    ] as const) {
      const mapped = c[key];
      if (mapped === undefined) continue;
      if (key === 'elevationM' && c.depthM !== undefined) continue;
      const target: FixColumnName = key === 'elevationM' ? 'depthM' : key;
      reader.#kinds[mapped.index] = KIND_NUMBER;
      reader.#targets[mapped.index] = column(target);
      let scale = 1;
      if (mapped.lengthUnit !== undefined && (key === 'depthM' || key === 'elevationM' || key === 'slantRangeM'))
        scale = toMetres(1, mapped.lengthUnit);
      if (mapped.speedUnit !== undefined && key === 'speedMps') scale = toMetresPerSecond(1, mapped.speedUnit);
      if (key === 'elevationM') scale = -scale;
      reader.#scales[mapped.index] = scale;
      if (key === 'headingDeg' || key === 'bearingDeg' || key === 'surfaceHeadingDeg') reader.#wrap[mapped.index] = 1;
    }
    // every batch column starts as NaN for the columns a row may leave empty
    for (const array of Object.values(reader.batch.columns)) array.fill(Number.NaN);
    return reader;
  }

  /** Whether the batch is full and should be handed on. */
  get full(): boolean {
    return this.batch.count === FAST_BATCH_ROWS;
  }

  /** Empties the batch (after the consumer copied it). */
  reset(): void {
    this.batch.count = 0;
  }

  /** Reads one row (characters `lineStart` to `lineEnd` of `text`) into the batch; `false` (and nothing written) when the row needs the general path. */
  read(text: string, lineStart: number, lineEnd: number, line: number, hasQuotes = false): boolean {
    const k = this.batch.count;
    const n = lineEnd;
    const width = this.#width;
    const kinds = this.#kinds;
    const targets = this.#targets;
    let start = lineStart;
    let field = 0;
    let depth = Number.NaN;
    for (; field < width; field++) {
      let end: number;
      let quoted = false;
      let scanned: number | undefined;
      if (hasQuotes && text.charCodeAt(start) === 34) {
        // a quoted field (RFC 4180 §2, "" inside for a quote): read here only for a coordinate,
        // and only when the closing quote ends the field
        end = quotedFieldEnd(text, start, n);
        if (end < 0) return false;
        if (end < n && !text.startsWith(this.#delimiter, end)) return false;
        quoted = true;
      } else if (!hasQuotes && NUMERIC_KINDS[kinds[field] as number] === 1) {
        // a number read while looking for the field's end (one pass over the characters)
        scanned = scanDecimal(text, start, n, this.#delimiterCode, this.#decimalMark2);
        end = scanStop;
        if (end < n && text.charCodeAt(end) !== this.#delimiterCode) {
          // not a plain number (a unit, degree symbols): the field's end, then the slower readers below
          end = text.indexOf(this.#delimiter, end);
          if (end < 0 || end > n) end = n;
          scanned = Number.NaN;
        }
      } else {
        end = text.indexOf(this.#delimiter, start);
        if (end < 0 || end > n) end = n;
        // a quote inside an unquoted field is the general path's to judge
        if (hasQuotes) {
          const q = text.indexOf('"', start);
          if (q >= 0 && q < end) return false;
        }
      }
      if (end < n && field === width - 1) {
        // one more field than the header: only a trailing empty one is tolerated
        if (end + 1 !== n) return false;
      }
      const kind = kinds[field] as number;
      if (quoted && kind !== KIND_IGNORE) {
        if (kind !== KIND_LAT && kind !== KIND_LON) return false;
        const v = parseDegreeSymbols(text, start + 1, end - 1, this.#decimalMark2, kind === KIND_LAT, 2);
        if (Number.isNaN(v) || (kind === KIND_LAT ? v < -90 || v > 90 : v < -180 || v > 180)) return false;
        (targets[field] as Float64Array)[k] = v;
      } else if (kind !== KIND_IGNORE) {
        const target = targets[field] as Float64Array;
        if (end === start) {
          if (this.#required[field] === 1) return false;
          target[k] = Number.NaN;
        } else if (kind === KIND_TIME_ISO) {
          const t = this.#isoDateTime(text, start, end);
          if (Number.isNaN(t)) return false;
          target[k] = t;
        } else if (kind === KIND_DATE) {
          if (!this.#date(text, start, end)) return false;
        } else if (kind === KIND_TIME_OF_DAY) {
          if (!this.#timeOfDay(text, start, end)) return false;
        } else {
          let v = scanned ?? parseDecimal(text, start, end, this.#decimalMark2);
          if (Number.isNaN(v) && (kind === KIND_LAT || kind === KIND_LON))
            v = parseDegreeSymbols(text, start, end, this.#decimalMark2, kind === KIND_LAT);
          if (Number.isNaN(v)) return false;
          if (kind === KIND_LAT) {
            if (v < -90 || v > 90) return false;
          } else if (kind === KIND_LON) {
            if (v < -180 || v > 180) return false;
          } else if (kind === KIND_PROJECTED) {
            // kept as read (the general path's number, sign of zero included)
          } else if (kind === KIND_TIME_S || kind === KIND_TIME_MS) {
            v = this.#times.acceptUtcMs(kind === KIND_TIME_S ? v * 1000 : v);
            if (Number.isNaN(v)) return false;
          } else {
            v = v * (this.#scales[field] as number) + 0;
            if (this.#wrap[field] === 1 && (v < 0 || v >= 360)) v = normaliseAzimuthDeg(v);
            if (target === this.batch.columns.depthM) depth = v;
          }
          target[k] = v;
        }
      }
      if (end >= n) {
        field++;
        break;
      }
      start = end + 1;
    }
    if (field !== width) return false;
    const xy = this.projected;
    // a surface easting without its northing (or the reverse) is the general path's to reject
    if (xy !== undefined && Number.isNaN(xy.sx[k] as number) !== Number.isNaN(xy.sy[k] as number)) return false;
    if (this.#dateAndTime) {
      // the general path's `fromFields`: wall clock plus the fraction, then the offset or the zone
      const wall = this.#rowDayMs + this.#rowTimeOfDayMs;
      const t = this.#rowTimeOfDayUtc ? this.#times.acceptUtcMs(wall) : this.#times.wallToUtcMs(wall);
      if (Number.isNaN(t)) return false;
      (this.batch.columns.timeMs as Float64Array)[k] = t;
    }
    if (!Number.isNaN(depth)) {
      this.depthCount++;
      if (depth < 0) this.negativeDepthCount++;
    }
    this.batch.lines[k] = line;
    this.batch.count = k + 1;
    return true;
  }

  /**
   * Appends a row the general path read (projected layouts keep every row in the batch until it is
   * converted): the fix's values into the batch columns, `NaN` where it has none.
   */
  appendFix(fix: Fix, line: number, x: number, y: number, sx: number, sy: number): void {
    const k = this.batch.count;
    const columns = this.batch.columns;
    for (const name in columns) {
      const value = fix[name as FixColumnName];
      (columns[name as FixColumnName] as Float64Array)[k] = value === undefined ? Number.NaN : value;
    }
    const xy = this.projected;
    if (xy !== undefined) {
      xy.x[k] = x;
      xy.y[k] = y;
      xy.sx[k] = sx;
      xy.sy[k] = sy;
    }
    this.batch.lines[k] = line;
    this.batch.count = k + 1;
  }

  /** Copies row `from` of the batch to row `to` (to drop rows in place, `to` <= `from`). */
  moveRow(from: number, to: number): void {
    if (from === to) return;
    const columns = this.batch.columns;
    for (const name in columns) {
      const array = columns[name as FixColumnName] as Float64Array;
      array[to] = array[from] as number;
    }
    this.batch.lines[to] = this.batch.lines[from] as number;
  }

  /**
   * `YYYY-MM-DDTHH:MM:SS[.fff]Z` (or a space for `T`) between `start` and `end` in UTC ms, or the
   * same without `Z` (`.fff` exactly three digits) read in the parser's zone; `NaN` for anything else.
   */
  #isoDateTime(s: string, start: number, end: number): number {
    const len = end - start;
    if (len < 19 || s.charCodeAt(start + 4) !== 45 || s.charCodeAt(start + 7) !== 45) return Number.NaN;
    const sep = s.charCodeAt(start + 10);
    if ((sep !== 84 && sep !== 32) || s.charCodeAt(start + 13) !== 58 || s.charCodeAt(start + 16) !== 58)
      return Number.NaN;
    const dayMs = this.#dayStart(s, start);
    if (Number.isNaN(dayMs)) return Number.NaN;
    const hour = digits(s, start + 11, 2);
    const minute = digits(s, start + 14, 2);
    const second = digits(s, start + 17, 2);
    // leap seconds go the general way
    if (hour < 0 || hour > 23 || minute < 0 || minute > 59 || second < 0 || second > 59) return Number.NaN;
    const clock = dayMs + hour * 3_600_000 + minute * 60_000 + second * 1000;
    if (s.charCodeAt(end - 1) !== 90) {
      // no `Z`: a wall-clock time, split at `T` or the space into a date and a time of day
      // (`parseDateAndTime`), the fraction as a time of day's
      if (len === 19) return this.#times.wallToUtcMs(clock);
      if (len !== 23 || s.charCodeAt(start + 19) !== 46) return Number.NaN;
      const fraction = digits(s, start + 20, 3);
      if (fraction < 0) return Number.NaN;
      return this.#times.wallToUtcMs(clock + (FRACTION_MS[fraction] as number));
    }
    let ms = 0;
    if (len > 20) {
      if (s.charCodeAt(start + 19) !== 46 || len === 21 || len > 30) return Number.NaN;
      let scale = 100;
      for (let i = start + 20; i < end - 1; i++) {
        const d = s.charCodeAt(i) - 48;
        if (d < 0 || d > 9) return Number.NaN;
        ms += d * scale;
        scale /= 10;
      }
    } else if (len !== 20) return Number.NaN;
    return this.#times.acceptUtcMs(clock + ms);
  }

  /** A date cell `YYYY-MM-DD` into the row's scratch; `false` for anything else. */
  #date(s: string, start: number, end: number): boolean {
    if (end - start !== 10 || s.charCodeAt(start + 4) !== 45 || s.charCodeAt(start + 7) !== 45) return false;
    this.#rowDayMs = this.#dayStart(s, start);
    return !Number.isNaN(this.#rowDayMs);
  }

  /** A time-of-day cell `HH:MM:SS[.fff][Z]` into the row's scratch; `false` for anything else. */
  #timeOfDay(s: string, start: number, end: number): boolean {
    let len = end - start;
    const utc = s.charCodeAt(end - 1) === 90;
    if (utc) len--;
    if ((len !== 8 && len !== 12) || s.charCodeAt(start + 2) !== 58 || s.charCodeAt(start + 5) !== 58) return false;
    const hour = digits(s, start, 2);
    const minute = digits(s, start + 3, 2);
    const second = digits(s, start + 6, 2);
    if (hour < 0 || hour > 23 || minute < 0 || minute > 59 || second < 0 || second > 59) return false;
    let ms = 0;
    if (len === 12) {
      const fraction = digits(s, start + 9, 3);
      if (s.charCodeAt(start + 8) !== 46 || fraction < 0) return false;
      ms = FRACTION_MS[fraction] as number;
    }
    this.#rowTimeOfDayMs = hour * 3_600_000 + minute * 60_000 + second * 1000 + ms;
    this.#rowTimeOfDayUtc = utc;
    return true;
  }

  /** UTC ms of midnight of the `YYYY-MM-DD` at `start` (calendar checked), or `NaN`. */
  #dayStart(s: string, start: number): number {
    const year = digits(s, start, 4);
    const month = digits(s, start + 5, 2);
    const day = digits(s, start + 8, 2);
    if (year < 0 || month < 1 || month > 12 || day < 1) return Number.NaN;
    const key = year * 10000 + month * 100 + day;
    if (key === this.#dayKey) return this.#dayMs;
    const leap = year % 4 === 0 && (year % 100 !== 0 || year % 400 === 0);
    if (day > (month === 2 && leap ? 29 : (MONTH_DAYS[month - 1] as number))) return Number.NaN;
    this.#dayKey = key;
    this.#dayMs = Date.UTC(year, month - 1, day);
    return this.#dayMs;
  }
}

function digits(s: string, start: number, count: number): number {
  let value = 0;
  for (let i = start; i < start + count; i++) {
    const d = s.charCodeAt(i) - 48;
    if (d < 0 || d > 9) return -1;
    value = value * 10 + d;
  }
  return value;
}

/**
 * Degrees and minutes, or degrees, minutes and seconds, written with symbols and a hemisphere letter
 * after them (`59°01.23457'N`, `005°28'07.407"E`) between `start` and `end`, or `NaN` (the general
 * path then reads or rejects the cell). Only the last component has decimals; minutes and seconds
 * below 60. The same value as `parseCoordinate`: sign × (degrees + minutes / 60 + seconds / 3600).
 */
export function parseDegreeSymbols(
  s: string,
  start: number,
  end: number,
  decimalMark2: number,
  lat: boolean,
  secondsMarkWidth: 1 | 2 = 1,
): number {
  const letter = s.charCodeAt(end - 1);
  let sign: number;
  if (lat)
    sign = letter === 78 ? 1 : letter === 83 ? -1 : 0; // N, S
  else sign = letter === 69 ? 1 : letter === 87 ? -1 : 0; // E, W
  if (sign === 0) return Number.NaN;
  const degreeAt = s.indexOf('°', start);
  if (degreeAt <= start || degreeAt >= end) return Number.NaN;
  const minuteAt = s.indexOf("'", degreeAt);
  if (minuteAt <= degreeAt + 1 || minuteAt >= end) return Number.NaN;
  const deg = parseDigits(s, start, degreeAt);
  let min: number;
  let sec = 0;
  if (minuteAt === end - 2) {
    min = parseDecimal(s, degreeAt + 1, minuteAt, decimalMark2);
  } else {
    // seconds: `'`, the number, `"` (`""` inside a quoted CSV field), the letter
    const secondsEnd = end - 1 - secondsMarkWidth;
    for (let i = secondsEnd; i < end - 1; i++) if (s.charCodeAt(i) !== 34) return Number.NaN;
    if (secondsEnd <= minuteAt + 1) return Number.NaN;
    min = parseDigits(s, degreeAt + 1, minuteAt);
    sec = parseDecimal(s, minuteAt + 1, secondsEnd, decimalMark2);
  }
  // a decimal mark must have digits after it (`01.'` is not a number)
  const last = s.charCodeAt(minuteAt === end - 2 ? minuteAt - 1 : end - 2 - secondsMarkWidth);
  if (last < 48 || last > 57) return Number.NaN;
  const first = s.charCodeAt(degreeAt + 1);
  if (first === 43 || first === 45 || s.charCodeAt(minuteAt + 1) === 43 || s.charCodeAt(minuteAt + 1) === 45)
    return Number.NaN;
  if (!(deg >= 0) || !(min >= 0 && min < 60) || !(sec >= 0 && sec < 60)) return Number.NaN;
  return sign * (deg + min / 60 + sec / 3600);
}

/** The index after the closing quote of the quoted field opening at `start`, or -1 when it does not close before `n`. */
function quotedFieldEnd(s: string, start: number, n: number): number {
  let i = start + 1;
  for (;;) {
    const q = s.indexOf('"', i);
    if (q < 0 || q >= n) return -1;
    if (q + 1 < n && s.charCodeAt(q + 1) === 34) i = q + 2;
    else return q + 1;
  }
}

/** Plain digits (no sign, no decimals, at most 15) between `start` and `end`, or `NaN`. */
function parseDigits(s: string, start: number, end: number): number {
  if (end <= start || end - start > 15) return Number.NaN;
  let value = 0;
  for (let i = start; i < end; i++) {
    const d = s.charCodeAt(i) - 48;
    if (d < 0 || d > 9) return Number.NaN;
    value = value * 10 + d;
  }
  return value;
}

/**
 * `[+-]digits[.digits]` between `start` and `end` (the second decimal mark may be a comma), or
 * `NaN`. Exact: an integer mantissa below 2^53 divided by an exact power of ten is correctly
 * rounded, as `Number()` would give; longer numbers go to `Number()`.
 */
export function parseDecimal(s: string, start: number, end: number, decimalMark2 = 46): number {
  // No delimiter (-1 matches no character): the whole range must be the number.
  return scanDecimal(s, start, end, -1, decimalMark2);
}
