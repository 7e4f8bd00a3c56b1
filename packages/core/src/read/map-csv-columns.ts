import { InvalidArgumentError } from '../errors.js';
import { type LengthUnit, parseLengthUnit, parseSpeedUnit, type SpeedUnit } from '../model/units.js';
import type { ColumnKey, ColumnReportEntry } from './log-read-result.js';
import { parseCoordinate } from './parse-coordinate.js';
import { parseDateFields, parseTimeFields } from './parse-log-time.js';

/** How the cells of a time column are written. */
export type TimeForm = 'datetime' | 'epoch-s' | 'epoch-ms' | 'time-of-day';

/** The reading plan for one mapped column. */
export interface MappedColumn {
  /** 0-based column index. */
  index: number;
  key: ColumnKey;
  lengthUnit?: LengthUnit;
  speedUnit?: SpeedUnit;
  timeForm?: TimeForm;
}

/** The mapping of a tabular log's columns, with the report the caller sees. */
export interface CsvColumnMap {
  columns: Partial<Record<ColumnKey, MappedColumn>>;
  report: ColumnReportEntry[];
  /** Set when the columns look like a surface unit's own log (only surface-qualified positions). */
  surfaceOnly: boolean;
  notes: string[];
}

const SURFACE_WORDS = new Set(['surface', 'ship', 'vessel', 'boat', 'topside', 'usv', 'asv', 'mothership', 'deck']);
const QUANTITY_WORDS: ReadonlyArray<readonly [ReadonlySet<string>, BaseQuantity]> = [
  [new Set(['lat', 'latitude', 'phi']), 'lat'],
  [new Set(['lon', 'lng', 'long', 'longitude', 'lambda']), 'lon'],
  [new Set(['depth', 'dpt', 'dep', 'dbt']), 'depth'],
  [new Set(['ele', 'elev', 'elevation', 'alt', 'altitude', 'height', 'z']), 'elevation'],
  [new Set(['heading', 'hdg', 'yaw', 'head']), 'heading'],
  [new Set(['speed', 'sog', 'spd', 'velocity']), 'speed'],
  [new Set(['quality', 'qual', 'fixquality', 'fixq']), 'quality'],
  [new Set(['slant', 'slantrange', 'range', 'rng', 'sr']), 'range'],
  [new Set(['bearing', 'brg', 'azimuth', 'az']), 'bearing'],
  [new Set(['datetime', 'timestamp', 'ts', 'epoch', 'unix', 'posix']), 'datetime'],
  [new Set(['time', 'utc', 't', 'clock']), 'time'],
  [new Set(['date', 'day']), 'date'],
  [new Set(['easting', 'east', 'x', 'e']), 'easting'],
  [new Set(['northing', 'north', 'y', 'n']), 'northing'],
];
type BaseQuantity =
  | 'lat'
  | 'lon'
  | 'depth'
  | 'elevation'
  | 'heading'
  | 'speed'
  | 'quality'
  | 'range'
  | 'bearing'
  | 'datetime'
  | 'time'
  | 'date'
  | 'easting'
  | 'northing';

const UNIT_TOKENS = new Set([
  'm',
  'ft',
  'feet',
  'deg',
  'degrees',
  'kn',
  'kt',
  'kts',
  'knots',
  'mps',
  'ms',
  's',
  'sec',
  'utc',
  'km',
  'kmh',
  'fm',
  'wgs84',
  'dd',
]);

interface NameGuess {
  key: ColumnKey;
  confidence: number;
  lengthUnit?: LengthUnit;
  speedUnit?: SpeedUnit;
  msHint: boolean;
}

/** Splits a header into lower-case words, pulling a unit out of brackets or a trailing suffix. */
export function tokeniseHeader(header: string): { words: string[]; unit?: string } {
  let text = header.trim();
  let unit: string | undefined;
  const bracket = /[([{]\s*([^)\]}]*)\s*[)\]}]\s*$/.exec(text);
  if (bracket !== null) {
    unit = (bracket[1] ?? '').trim();
    text = text.slice(0, bracket.index);
  }
  const words = text
    .replace(/([a-z])([A-Z])/g, '$1 $2')
    .replace(/°/g, ' deg ')
    .toLowerCase()
    .split(/[^a-z0-9/]+/)
    .filter((w) => w.length > 0);
  if (unit === undefined && words.length > 1) {
    const last = words[words.length - 1] as string;
    if (UNIT_TOKENS.has(last) || parseLengthUnit(last) !== undefined || parseSpeedUnit(last) !== undefined) {
      unit = last;
      words.pop();
    }
  }
  return unit === undefined ? { words } : { words, unit };
}

/** Guesses what a header names, from its words alone. */
export function guessColumnFromName(header: string): NameGuess | undefined {
  const { words, unit } = tokeniseHeader(header);
  if (words.length === 0) return undefined;
  const surface = words.some((w) => SURFACE_WORDS.has(w));
  let quantity: BaseQuantity | undefined;
  let exact = false;
  for (const word of words) {
    for (const [set, q] of QUANTITY_WORDS) {
      if (set.has(word)) {
        // `date` + `time` in one header is a full date-time
        if ((q === 'time' && quantity === 'date') || (q === 'date' && quantity === 'time')) quantity = 'datetime';
        else if (quantity === undefined) quantity = q;
        break;
      }
    }
  }
  const joined = words.join('');
  if (quantity === undefined) {
    if (joined.includes('slantrange')) quantity = 'range';
    else if (joined.includes('datetime') || joined.includes('timestamp')) quantity = 'datetime';
    else return undefined;
  } else {
    exact = words.length === 1;
  }
  // A lone `x`/`y`/`e`/`n`/`t`/`z` header is a weaker hint than a word.
  const weak = words.length === 1 && (words[0] as string).length === 1;
  const confidence = weak ? 0.6 : exact ? 0.95 : 0.85;
  const msHint = words.includes('ms') || words.includes('millis') || words.includes('milliseconds') || unit === 'ms';
  const guess = (key: ColumnKey): NameGuess => {
    const g: NameGuess = { key, confidence, msHint };
    if (unit !== undefined) {
      const lengthUnit = parseLengthUnit(unit);
      if (lengthUnit !== undefined) g.lengthUnit = lengthUnit;
      const speedUnit = parseSpeedUnit(unit);
      if (speedUnit !== undefined) g.speedUnit = speedUnit;
    }
    return g;
  };
  switch (quantity) {
    case 'lat':
      return guess(surface ? 'surfaceLatDeg' : 'latDeg');
    case 'lon':
      return guess(surface ? 'surfaceLonDeg' : 'lonDeg');
    case 'heading':
      return guess(surface ? 'surfaceHeadingDeg' : 'headingDeg');
    case 'depth':
      return surface ? undefined : guess('depthM');
    case 'elevation':
      return surface ? undefined : guess('elevationM');
    case 'speed':
      return surface ? undefined : guess('speedMps');
    case 'quality':
      return guess('quality');
    case 'range':
      return guess('slantRangeM');
    case 'bearing':
      return guess('bearingDeg');
    case 'datetime':
      return guess('timeMs');
    case 'time':
      return guess('time');
    case 'date':
      return guess('date');
    case 'easting':
      return guess(surface ? 'surfaceEasting' : 'easting');
    case 'northing':
      return guess(surface ? 'surfaceNorthing' : 'northing');
  }
}

/**
 * Maps the columns of a tabular log: explicit `columns` option first (header name or 1-based
 * index), then header names (with unit suffixes), then cell contents for what is still missing
 * (time forms, latitude/longitude by hemisphere letters or ranges). Decides each time column's
 * form from sample cells. Throws `InvalidArgumentError` when the option names a column that does not exist.
 */
export function mapCsvColumns(
  headers: readonly string[] | undefined,
  sample: readonly (readonly string[])[],
  width: number,
  explicit: Partial<Record<ColumnKey, string>> | undefined,
  decimalComma: boolean,
): CsvColumnMap {
  const report: ColumnReportEntry[] = [];
  const notes: string[] = [];
  for (let i = 0; i < width; i++) {
    report.push({
      index: i + 1,
      header: headers?.[i]?.trim() || `column ${i + 1}`,
      target: 'unused',
      confidence: 0,
      how: 'none',
    });
  }
  const columns: Partial<Record<ColumnKey, MappedColumn>> = {};
  const taken = new Set<number>();
  const msHints = new Set<number>();
  const assign = (
    index: number,
    key: ColumnKey,
    confidence: number,
    how: ColumnReportEntry['how'],
    extra: Partial<MappedColumn> = {},
  ) => {
    columns[key] = { index, key, ...extra };
    taken.add(index);
    const entry = report[index];
    if (entry !== undefined) {
      entry.target = key;
      entry.confidence = confidence;
      entry.how = how;
    }
  };
  // 1. the explicit map
  for (const [key, ref] of Object.entries(explicit ?? {}) as [ColumnKey, string][]) {
    if (ref === undefined) continue;
    let index = -1;
    if (/^\d+$/.test(ref.trim())) index = Number(ref) - 1;
    else if (headers !== undefined) index = headers.findIndex((h) => h.trim() === ref.trim());
    if (index < 0 || index >= width) {
      throw new InvalidArgumentError(
        `column map: ${key}=${ref} names no column (the log has ${headers === undefined ? `${width} unnamed columns` : `columns ${headers.map((h) => `"${h.trim()}"`).join(', ')}`})`,
      );
    }
    const extra: Partial<MappedColumn> = {};
    const name = headers?.[index];
    if (name !== undefined) {
      const guess = guessColumnFromName(name);
      if (guess?.lengthUnit !== undefined) extra.lengthUnit = guess.lengthUnit;
      if (guess?.speedUnit !== undefined) extra.speedUnit = guess.speedUnit;
      if (guess?.msHint) msHints.add(index);
    }
    assign(index, key, 1, 'option', extra);
  }
  // 2. header names
  if (headers !== undefined) {
    const guesses = headers.map((h) => guessColumnFromName(h));
    const order = guesses.map((g, i) => ({ g, i })).sort((a, b) => (b.g?.confidence ?? 0) - (a.g?.confidence ?? 0));
    for (const { g, i } of order) {
      if (g === undefined || taken.has(i)) continue;
      if (columns[g.key] !== undefined) {
        notes.push(
          `column ${i + 1} "${headers[i]?.trim()}" also looks like ${g.key}; column ${(columns[g.key]?.index ?? 0) + 1} is used`,
        );
        continue;
      }
      const extra: Partial<MappedColumn> = {};
      if (g.lengthUnit !== undefined) extra.lengthUnit = g.lengthUnit;
      if (g.speedUnit !== undefined) extra.speedUnit = g.speedUnit;
      if (g.msHint) msHints.add(i);
      assign(i, g.key, g.confidence, 'name', extra);
    }
  }
  // 3. content, for what is still missing
  const cells = (i: number) => sample.map((row) => (row[i] ?? '').trim()).filter((c) => c.length > 0);
  const free = () => [...Array(width).keys()].filter((i) => !taken.has(i));
  if (columns.timeMs === undefined && columns.time === undefined) {
    for (const i of free()) {
      const values = cells(i);
      if (values.length > 0 && values.every((v) => /^\d{4}[-/.]\d{1,2}[-/.]\d{1,2}[T ]\d/.test(v))) {
        assign(i, 'timeMs', 0.8, 'content');
        break;
      }
    }
  }
  if (columns.latDeg === undefined && columns.lonDeg === undefined && columns.easting === undefined) {
    const hemi = (i: number, letters: RegExp) => {
      const values = cells(i);
      return values.length > 0 && values.every((v) => letters.test(v) && /\d/.test(v));
    };
    const lat = free().find((i) => hemi(i, /^[NS]|[NS]$/i));
    const lon = free().find((i) => hemi(i, /^[EW]|[EW]$/i));
    if (lat !== undefined && lon !== undefined) {
      assign(lat, 'latDeg', 0.8, 'content');
      assign(lon, 'lonDeg', 0.8, 'content');
    } else {
      const numeric = (i: number, limit: number) => {
        const values = cells(i);
        return (
          values.length > 0 &&
          values.every((v) => {
            const n = Number(decimalComma ? v.replace(',', '.') : v);
            return Number.isFinite(n) && Math.abs(n) <= limit && !Number.isInteger(n);
          })
        );
      };
      const candidates = free();
      for (let k = 0; k + 1 < candidates.length; k++) {
        const a = candidates[k] as number;
        const b = candidates[k + 1] as number;
        if (b === a + 1 && numeric(a, 90) && numeric(b, 180)) {
          assign(a, 'latDeg', 0.5, 'content');
          assign(b, 'lonDeg', 0.5, 'content');
          notes.push(
            `latitude and longitude guessed from content as columns ${a + 1} and ${b + 1} (confidence 0.5); pass a column map to be sure`,
          );
          break;
        }
      }
    }
  }
  if (columns.timeMs === undefined && columns.time === undefined) {
    for (const i of free()) {
      const values = cells(i);
      if (values.length > 0 && values.every((v) => /^\d{9,13}(\.\d+)?$/.test(v))) {
        assign(i, 'timeMs', 0.6, 'content');
        break;
      }
    }
  }
  // 4. time forms
  const timeColumn = columns.timeMs ?? columns.time;
  if (timeColumn !== undefined) {
    const values = cells(timeColumn.index);
    const numeric = values.length > 0 && values.every((v) => /^\d+([.,]\d+)?$/.test(v) && !/^\d{6}([.,]\d+)?$/.test(v));
    if (numeric) {
      const big = values.some((v) => Number(v.replace(',', '.')) > 1e11);
      timeColumn.timeForm = big || msHints.has(timeColumn.index) ? 'epoch-ms' : 'epoch-s';
    } else if (values.length > 0 && values.every((v) => parseTimeFields(v) !== undefined)) {
      timeColumn.timeForm = 'time-of-day';
    } else {
      timeColumn.timeForm = 'datetime';
    }
    if (timeColumn.timeForm !== 'time-of-day' && timeColumn.key === 'time' && columns.date === undefined) {
      // a column called `time` holding full date-times
      delete columns.time;
      timeColumn.key = 'timeMs';
      columns.timeMs = timeColumn;
      const entry = report[timeColumn.index];
      if (entry !== undefined) entry.target = 'timeMs';
    }
    if (timeColumn.timeForm === 'time-of-day' && timeColumn.key === 'timeMs') {
      delete columns.timeMs;
      timeColumn.key = 'time';
      columns.time = timeColumn;
      const entry = report[timeColumn.index];
      if (entry !== undefined) entry.target = 'time';
    }
    const entry = report[timeColumn.index];
    if (entry !== undefined) entry.form = timeColumn.timeForm;
  }
  if (columns.date !== undefined) {
    const values = cells(columns.date.index);
    if (values.some((v) => /^\d{1,2}\/\d{1,2}\/\d{4}$/.test(v)))
      notes.push('dates written NN/NN/YYYY are read day first (DD/MM/YYYY)');
    if (values.length > 0 && !values.every((v) => parseDateFields(v) !== undefined)) {
      notes.push(`column ${columns.date.index + 1} holds values that are not dates; those rows are rejected`);
    }
  }
  for (const key of ['latDeg', 'lonDeg', 'surfaceLatDeg', 'surfaceLonDeg'] as const) {
    const column = columns[key];
    if (column === undefined) continue;
    const first = cells(column.index)[0];
    const parsed =
      first === undefined ? undefined : parseCoordinate(first, key.toLowerCase().includes('lat') ? 'lat' : 'lon');
    const entry = report[column.index];
    if (entry !== undefined && parsed?.ok) entry.form = parsed.form;
  }
  for (const column of Object.values(columns)) {
    const entry = report[column.index];
    if (entry === undefined) continue;
    if (column.lengthUnit !== undefined) entry.form = column.lengthUnit;
    if (column.speedUnit !== undefined) entry.form = column.speedUnit;
  }
  // A log whose only positions are surface-qualified is the surface unit's own log.
  const noVehiclePosition =
    columns.latDeg === undefined &&
    columns.lonDeg === undefined &&
    columns.easting === undefined &&
    columns.northing === undefined;
  const renames: Array<[ColumnKey, ColumnKey]> = [];
  if (noVehiclePosition && columns.surfaceLatDeg !== undefined && columns.surfaceLonDeg !== undefined) {
    renames.push(['surfaceLatDeg', 'latDeg'], ['surfaceLonDeg', 'lonDeg']);
  } else if (noVehiclePosition && columns.surfaceEasting !== undefined && columns.surfaceNorthing !== undefined) {
    renames.push(['surfaceEasting', 'easting'], ['surfaceNorthing', 'northing']);
  }
  const surfaceOnly = renames.length > 0;
  if (surfaceOnly && columns.surfaceHeadingDeg !== undefined && columns.headingDeg === undefined) {
    renames.push(['surfaceHeadingDeg', 'headingDeg']);
  }
  for (const [from, to] of renames) {
    const column = columns[from] as MappedColumn;
    columns[to] = { ...column, key: to };
    delete columns[from];
    const entry = report[column.index];
    if (entry !== undefined) entry.target = to;
  }
  const mapped = report.filter((e) => e.target !== 'unused');
  notes.push(
    `column mapping: ${mapped.map((e) => `${e.target} <- ${e.header} (${e.how}, ${e.confidence.toFixed(2)}${e.form === undefined ? '' : `, ${e.form}`})`).join('; ')}`,
  );
  const unused = report.filter((e) => e.target === 'unused');
  if (unused.length > 0) notes.push(`columns not used: ${unused.map((e) => e.header).join(', ')}`);
  return { columns, report, surfaceOnly, notes };
}
