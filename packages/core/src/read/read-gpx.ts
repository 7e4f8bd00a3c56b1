import { SaxesParser, type SaxesTagPlain } from 'saxes';
import type { Rejection } from '../model/rejection.js';
import {
  type DepthSignDecision,
  FIX_COLUMN_NAMES,
  type FixColumnName,
  type TrackRole,
  type Waypoint,
} from '../model/track.js';
import { normaliseAzimuthDeg } from '../model/units.js';
import { collectReadEvents } from './collect-read-events.js';
import { decodeLogText } from './decode-log-text.js';
import type { LogInput, LogReadResult, ReadOptions } from './log-read-result.js';
import { parseCoordinate } from './parse-coordinate.js';
import { parseDecimal } from './parse-csv-row-fast.js';
import { LogTimeParser } from './parse-log-time.js';
import type { LogTextInput } from './read-csv.js';
import { refusedLog } from './read-csv.js';
import type { FixBatch, ReadEvent } from './read-event.js';
import { findForbiddenXml } from './refuse-forbidden-xml.js';
import { scanGpxFast, type XmlElementHandlers } from './scan-gpx-fast.js';

/** Text fed to the XML parser at a time: keeps the event queue, not the file, in memory. */
const FEED_CHARS = 1 << 20;
/** Longest element text kept (names, descriptions); the rest is dropped. */
const MAX_TEXT_CHARS = 4096;

const DEPTH_NAMES = /^(depth|dpt|waterdepth|depthm|depth_m)$/i;
const HEADING_NAMES = /^(heading|hdg|yaw)(_deg)?$/i;
const SPEED_NAMES = /^(speed|sog)(_mps)?$/i;
const RANGE_NAMES = /^(slantrange|slant_range|range)(_m)?$/i;
const BEARING_NAMES = /^(bearing|brg)(_(rel|relative|true|mag|magnetic))?(_deg)?$/i;
const QUALITY_NAMES = /^(quality|fixquality)$/i;
const SURFACE_LAT_NAMES = /^(surface|ship|vessel)_?lat(itude)?(_deg)?$/i;
const SURFACE_LON_NAMES = /^(surface|ship|vessel)_?lon(gitude)?(_deg)?$/i;
const SURFACE_HEADING_NAMES = /^(surface|ship|vessel)_?heading(_deg)?$/i;
const OPTIONAL_KEYS = [
  'ele',
  'depth',
  'heading',
  'speed',
  'range',
  'bearing',
  'quality',
  'surfaceLat',
  'surfaceLon',
  'surfaceHeading',
] as const;
type OptionalKey = (typeof OPTIONAL_KEYS)[number];
/** Where a point's leaf element goes on the point path: an index into `OPTIONAL_KEYS`, or one of these. */
const SLOT_TIME = -1;
const SLOT_IGNORED = -2;
/** A leaf the point path leaves to the general one: one named like a point (the general path ends a point at its own name's end tag). */
const SLOT_DECLINE = -3;
const SURFACE_TRACK = /surface|ship|vessel|boat|topside/i;
const UNDERWATER_HINT = /\b(rov|auv|vehicle|diver|dive|transponder|beacon|underwater)\b/i;

interface PointState {
  kind: 'trkpt' | 'rtept' | 'wpt';
  line: number;
  column: number;
  lat: string;
  lon: string;
  ele?: string;
  time?: string;
  name?: string;
  desc?: string;
  depth?: string;
  heading?: string;
  speed?: string;
  range?: string;
  bearing?: string;
  quality?: string;
  surfaceLat?: string;
  surfaceLon?: string;
  surfaceHeading?: string;
  fix?: string;
}

interface TrackStats {
  name?: string;
  type?: string;
  role: TrackRole;
  opened: boolean;
  eleCount: number;
  elePositive: number;
  depthCount: number;
  isRoute: boolean;
}

/**
 * Streams a GPX 1.1 or 1.0 log as read events: each `trk` and `rte` becomes a track (role
 * `surface` when its name or type says surface unit, ship or vessel), each `trkseg` a segment,
 * each `wpt` a waypoint. Depth comes from an extension element named like depth in any namespace
 * (positive down), else from `ele` negated; a vehicle track whose `ele` is all positive is reported
 * as doubtful, never silently flipped. Heading, speed, slant range, bearing, quality and surface position come from
 * extension elements by local name (and GPX 1.0 `speed`). Refuses DOCTYPE entity declarations before
 * parsing (`forbidden-xml-construct`). Rejections: `malformed-xml` (reading stops; earlier points
 * stay), `missing-value` (a track point without time), `unparsable-coordinate`,
 * `latitude-out-of-range`, `longitude-out-of-range`, `unparsable-time`, `time-out-of-range`,
 * `unparsable-number`.
 */
export function* readGpxEvents(input: LogTextInput, options: ReadOptions = {}): Generator<ReadEvent> {
  const whole = singleChunk(input.chunks);
  if (whole !== undefined) {
    const fast = createGpxHandlers(input.fileName, options);
    if (scanGpxFast(whole, fast)) {
      fast.flushFixes();
      hintTrackSizes(fast.queue);
      yield* fast.queue;
      yield* finishGpx(fast);
      return;
    }
  }
  const state = createGpxHandlers(input.fileName, options);
  const parser = new SaxesParser({ xmlns: false, position: true, fileName: input.fileName });
  parser.on('error', (error) => {
    if (state.failed) return;
    state.failed = true;
    state.rowCount++;
    state.reject(
      parser.line,
      'malformed-xml',
      'well-formed XML',
      error.message.replace(/^[^:]*:\d+:\d+: /, ''),
      parser.column > 0 ? parser.column : undefined,
    );
  });
  parser.on('opentag', (tag: SaxesTagPlain) => state.open(tag.name, tag.attributes, parser.line, parser.column));
  parser.on('text', state.text);
  parser.on('cdata', state.text);
  parser.on('closetag', (tag) => state.close(tag.name));
  const queue = state.queue;
  for (const chunk of input.chunks) {
    for (let at = 0; at < chunk.length && !state.failed; at += FEED_CHARS) {
      parser.write(chunk.slice(at, at + FEED_CHARS));
      state.flushFixes();
      yield* queue;
      queue.length = 0;
    }
    if (state.failed) break;
  }
  if (!state.failed) parser.close();
  state.flushFixes();
  yield* queue;
  queue.length = 0;
  yield* finishGpx(state);
}

/**
 * Gives each track event the number of fixes that follow it as `capacityHint`, so the consumer sizes
 * the track's columns once (on the fast path the whole file's events are at hand before any is
 * handed on).
 */
function hintTrackSizes(events: ReadEvent[]): void {
  let track: Extract<ReadEvent, { kind: 'track' }> | undefined;
  let fixes = 0;
  for (const event of events) {
    if (event.kind === 'track') {
      if (track !== undefined && fixes > 0) track.capacityHint = fixes;
      track = event;
      fixes = 0;
    } else if (event.kind === 'fix-batch') fixes += event.batch.count;
  }
  if (track !== undefined && fixes > 0) track.capacityHint = fixes;
}

/** The one string of a text given whole (as `readLog` gives it), else `undefined`. */
function singleChunk(chunks: Iterable<string>): string | undefined {
  return Array.isArray(chunks) && chunks.length === 1 && typeof chunks[0] === 'string' ? chunks[0] : undefined;
}

/** What the element handlers gathered, and the handlers themselves (driven by saxes or by `scanGpxFast`). */
interface GpxHandlers extends XmlElementHandlers {
  queue: ReadEvent[];
  rowCount: number;
  version: string;
  failed: boolean;
  trackStats: TrackStats[];
  reject: (line: number, code: Rejection['code'], expected: string, found: string, column?: number) => void;
  point: NonNullable<XmlElementHandlers['point']>;
  /** Puts the fixes gathered so far into `queue` (before it is handed on). */
  flushFixes: () => void;
}

/** First and largest size of a batch of GPX fixes. */
const GPX_BATCH_FIRST = 256;
const GPX_BATCH_MAX = 4096;

/**
 * The columns a GPX fix may do without, in `storeFix`'s order. A batch gets one when a fix in it
 * first has a value for it (`NaN` before), so it carries only the columns its fixes use: fewer
 * arrays to allocate and fill, and to copy (a column left out of a batch reads as `NaN`).
 */
const OPTIONAL_COLUMNS = [
  'depthM',
  'headingDeg',
  'speedMps',
  'slantRangeM',
  'bearingDeg',
  'quality',
  'surfaceLatDeg',
  'surfaceLonDeg',
  'surfaceHeadingDeg',
] as const;

/** A batch with the columns every fix has (time and position). */
function newGpxBatch(capacity: number): FixBatch {
  return {
    count: 0,
    lines: new Uint32Array(capacity),
    columns: {
      timeMs: new Float64Array(capacity),
      latDeg: new Float64Array(capacity),
      lonDeg: new Float64Array(capacity),
    },
  };
}

function growGpxBatch(batch: FixBatch, capacity: number): FixBatch {
  const grown: FixBatch = { count: batch.count, lines: new Uint32Array(capacity), columns: {} };
  grown.lines.set(batch.lines);
  for (const name of FIX_COLUMN_NAMES) {
    const column = batch.columns[name];
    if (column === undefined) continue;
    const copy = new Float64Array(capacity);
    copy.set(column);
    grown.columns[name] = copy;
  }
  return grown;
}

/**
 * The reader's element handlers: one call per start tag, text piece and end tag, in document order.
 * Events go to `queue`.
 */
function createGpxHandlers(file: string, options: ReadOptions): GpxHandlers {
  const times = new LogTimeParser('UTC');
  const queue: ReadEvent[] = [];
  const stack: string[] = [];
  let point: PointState | undefined;
  let track: TrackStats | undefined;
  const trackStats: TrackStats[] = [];
  let text = '';
  let waypointCount = 0;
  const state = { queue, rowCount: 0, version: '', failed: false, trackStats } as GpxHandlers;
  const reject = (line: number, code: Rejection['code'], expected: string, found: string, column?: number) => {
    pushEvent({
      kind: 'rejection',
      rejection:
        column === undefined ? { file, line, code, expected, found } : { file, line, column, code, expected, found },
    });
  };
  state.reject = reject;
  // Fixes gather in a batch, column by column; any other event first hands on the batch so far (file
  // order kept). A batch handed on is never written again: the queue may hold it a while.
  let batch = newGpxBatch(GPX_BATCH_FIRST);
  /** The batch's `OPTIONAL_COLUMNS` it has so far. */
  const optional: (Float64Array | undefined)[] = OPTIONAL_COLUMNS.map(() => undefined);
  const flushFixes = (): void => {
    if (batch.count === 0) return;
    queue.push({ kind: 'fix-batch', batch });
    // as large as the last one grew: a long track fills batches of the largest size one after another
    batch = newGpxBatch(batch.lines.length);
    optional.fill(undefined);
  };
  const pushEvent = (event: ReadEvent): void => {
    flushFixes();
    queue.push(event);
  };
  /** The row for the next fix, growing the batch (up to `GPX_BATCH_MAX` rows) or handing it on when full. */
  const reserveFix = (): number => {
    const capacity = batch.lines.length;
    if (batch.count === capacity) {
      if (capacity >= GPX_BATCH_MAX) flushFixes();
      else {
        batch = growGpxBatch(batch, capacity * 2);
        for (let k = 0; k < OPTIONAL_COLUMNS.length; k++)
          optional[k] = batch.columns[OPTIONAL_COLUMNS[k] as FixColumnName];
      }
    }
    return batch.count;
  };
  /** Value `value` of row `i` into the batch's optional column `k`, adding the column for a first value. */
  const putOptional = (k: number, i: number, value: number): void => {
    let column = optional[k];
    if (column === undefined) {
      if (Number.isNaN(value)) return;
      column = new Float64Array(batch.lines.length).fill(Number.NaN);
      batch.columns[OPTIONAL_COLUMNS[k] as FixColumnName] = column;
      optional[k] = column;
    }
    column[i] = value;
  };
  state.flushFixes = flushFixes;
  const openTrackIfNeeded = () => {
    if (track === undefined || track.opened) return;
    track.opened = true;
    const label = `${track.name ?? ''} ${track.type ?? ''}`;
    if (options.role === undefined && SURFACE_TRACK.test(label)) track.role = 'surface';
    const event: ReadEvent = { kind: 'track', role: track.role };
    if (track.name !== undefined) event.name = track.name;
    pushEvent(event);
  };
  state.open = (name, attributes, line, column) => {
    const local = localName(name);
    const parent = stack[stack.length - 1];
    stack.push(local);
    text = '';
    if (stack.length === 1) {
      state.version = attributes.version ?? '';
      if (local !== 'gpx') reject(line, 'unknown-format', 'a <gpx> root element', `<${name}>`);
      return;
    }
    if (local === 'trk' || local === 'rte') {
      track = {
        role: options.role ?? 'vehicle',
        opened: false,
        eleCount: 0,
        elePositive: 0,
        depthCount: 0,
        isRoute: local === 'rte',
      };
      trackStats.push(track);
      return;
    }
    if (local === 'trkseg') {
      openTrackIfNeeded();
      pushEvent({ kind: 'segment' });
      return;
    }
    if (
      (local === 'trkpt' && parent === 'trkseg') ||
      (local === 'rtept' && parent === 'rte') ||
      (local === 'wpt' && parent === 'gpx')
    ) {
      if (local !== 'wpt') openTrackIfNeeded();
      point = {
        kind: local,
        line,
        column,
        lat: attributes.lat ?? '',
        lon: attributes.lon ?? '',
      };
    }
  };
  // Element text is capped: a 200 MB <name> must not be copied around; values that long are never numbers or times.
  state.text = (t) => {
    if (text.length < MAX_TEXT_CHARS) text += t.length > MAX_TEXT_CHARS ? t.slice(0, MAX_TEXT_CHARS) : t;
  };
  state.close = (name) => {
    if (state.failed) return;
    const local = localName(name);
    stack.pop();
    const value = text.trim();
    text = '';
    if (point !== undefined) {
      if (local === point.kind) {
        state.rowCount++;
        finishPoint(point);
        point = undefined;
        return;
      }
      if (local === 'ele') point.ele = value;
      else if (local === 'time') point.time = value;
      else if (local === 'name') point.name = value;
      else if (local === 'desc') point.desc = value;
      else if (local === 'fix') point.fix = value;
      else {
        const key = extensionKey(local);
        if (key !== undefined) point[key] = value;
      }
      return;
    }
    if (track !== undefined) {
      const parent = stack[stack.length - 1];
      if ((parent === 'trk' || parent === 'rte') && local === 'name') track.name = value;
      if ((parent === 'trk' || parent === 'rte') && local === 'type') track.type = value;
      if (local === 'trk' || local === 'rte') {
        openTrackIfNeeded();
        pushEvent({ kind: 'depth-sign', decision: decideGpxDepthSign(track, trackStats) });
        track = undefined;
      }
    }
  };
  const optionalValues = new Float64Array(OPTIONAL_KEYS.length);
  const finishPoint = (p: PointState) => {
    const lat = parseCoordinate(p.lat, 'lat');
    if (!lat.ok)
      return reject(
        p.line,
        p.lat === '' ? 'missing-value' : lat.code,
        `a lat attribute: ${lat.expected}`,
        `"${p.lat}"`,
      );
    const lon = parseCoordinate(p.lon, 'lon');
    if (!lon.ok)
      return reject(
        p.line,
        p.lon === '' ? 'missing-value' : lon.code,
        `a lon attribute: ${lon.expected}`,
        `"${p.lon}"`,
      );
    let timeMs = Number.NaN;
    if (p.time !== undefined && p.time !== '') {
      const t = times.parseDateTime(p.time);
      if (!t.ok) return reject(p.line, t.code, `<time>: ${t.expected}`, `"${p.time}"`);
      timeMs = t.timeMs;
    } else if (p.kind === 'trkpt') {
      return reject(p.line, 'missing-value', 'a <time> in every track point', 'no <time>');
    }
    // optional values into a reused array (no object per point on the hot path)
    const values = optionalValues;
    for (let k = 0; k < OPTIONAL_KEYS.length; k++) {
      const key = OPTIONAL_KEYS[k] as OptionalKey;
      const raw = p[key];
      values[k] = Number.NaN;
      if (raw === undefined || raw === '') continue;
      const n = Number(raw);
      if (!Number.isFinite(n)) {
        return reject(
          p.line,
          /^[+-]?(nan|inf)/i.test(raw) ? 'non-finite-value' : 'unparsable-number',
          `a number in <${key}>`,
          `"${raw}"`,
        );
      }
      values[k] = n;
    }
    if (p.kind === 'wpt') {
      const waypoint: Waypoint = {
        name: p.name ?? `waypoint ${++waypointCount}`,
        latDeg: lat.deg,
        lonDeg: lon.deg,
        depthM: depthOf(values),
        timeMs,
        sourceLine: p.line,
      };
      if (p.desc !== undefined) waypoint.description = p.desc;
      pushEvent({ kind: 'waypoint', waypoint });
      return;
    }
    storeFix(p.line, lat.deg, lon.deg, timeMs, values);
  };
  /** A track or route point's values (`values` in `OPTIONAL_KEYS` order, `NaN` for none) into the track's counts and the batch. */
  const storeFix = (line: number, latDeg: number, lonDeg: number, timeMs: number, values: Float64Array): void => {
    const ele = values[0] as number;
    const depth = values[1] as number;
    if (track !== undefined) {
      if (!Number.isNaN(depth)) track.depthCount++;
      else if (!Number.isNaN(ele)) {
        track.eleCount++;
        if (ele > 0) track.elePositive++;
      }
    }
    const heading = values[2] as number;
    const bearing = values[5] as number;
    const surfaceLat = values[7] as number;
    const surfaceLon = values[8] as number;
    const surfaceHeading = values[9] as number;
    // into the batch's columns, `NaN` for what the point does not have (as a `Fix` without it)
    const i = reserveFix();
    const c = batch.columns as Required<Pick<FixBatch['columns'], 'timeMs' | 'latDeg' | 'lonDeg'>>;
    c.timeMs[i] = timeMs;
    c.latDeg[i] = latDeg;
    c.lonDeg[i] = lonDeg;
    putOptional(0, i, depthOf(values));
    putOptional(1, i, Number.isNaN(heading) ? Number.NaN : normaliseAzimuthDeg(heading));
    putOptional(2, i, values[3] as number);
    putOptional(3, i, values[4] as number);
    putOptional(4, i, Number.isNaN(bearing) ? Number.NaN : normaliseAzimuthDeg(bearing));
    putOptional(5, i, values[6] as number);
    putOptional(6, i, Math.abs(surfaceLat) <= 90 ? surfaceLat : Number.NaN);
    putOptional(7, i, Math.abs(surfaceLon) <= 180 ? surfaceLon : Number.NaN);
    putOptional(8, i, Number.isNaN(surfaceHeading) ? Number.NaN : normaliseAzimuthDeg(surfaceHeading));
    batch.lines[i] = line;
    batch.count = i + 1;
  };
  // The point path: a plain point (see `PlainPointScanner`) read straight from the text. It gives what
  // `open`, `close` and `finishPoint` give for the same point: the same values (`parseDecimal` is
  // `Number()` wherever it reads a number; the time goes through the same parser), the same leaf
  // names by local name, the last of a repeated leaf. Anything else it declines before changing
  // anything: a number `parseDecimal` does not read, a coordinate out of range, a time that does not
  // parse, a track point without time, a point inside a point, a leaf named like a point. The general
  // path then reads or rejects that point.
  const pointValues = new Float64Array(OPTIONAL_KEYS.length);
  const leafSlots = new LeafSlots();
  state.point = (s, found, line) => {
    if (point !== undefined) return false;
    const latDeg = parseDecimal(s, found.latStart, found.latEnd);
    const lonDeg = parseDecimal(s, found.lonStart, found.lonEnd);
    if (!(Math.abs(latDeg) <= 90 && Math.abs(lonDeg) <= 180)) return false;
    const values = pointValues;
    for (let k = 0; k < values.length; k++) values[k] = Number.NaN;
    let timeStart = -1;
    let timeEnd = -1;
    const names = found.leafNames;
    const leafText = found.leafText;
    for (let k = 0; k < found.leafCount; k++) {
      const slot = leafSlots.slotOf(k, names[k] as string);
      if (slot === SLOT_IGNORED) continue;
      if (slot === SLOT_DECLINE) return false;
      const start = leafText[2 * k] as number;
      const end = leafText[2 * k + 1] as number;
      if (slot === SLOT_TIME) {
        timeStart = start;
        timeEnd = end;
      } else if (start === end) values[slot] = Number.NaN;
      else {
        const n = parseDecimal(s, start, end);
        if (Number.isNaN(n)) return false;
        values[slot] = n;
      }
    }
    let timeMs = Number.NaN;
    if (timeEnd > timeStart) {
      const t = times.parseDateTime(s.slice(timeStart, timeEnd));
      if (!t.ok) return false;
      timeMs = t.timeMs;
    } else if (found.kind === 'trkpt') return false;
    text = '';
    state.rowCount++;
    openTrackIfNeeded();
    storeFix(line, latDeg, lonDeg, timeMs, values);
    return true;
  };
  return state;
}

/** Depth from a point's values (`OPTIONAL_KEYS` order): the depth element's, else `ele` negated, else `NaN`. */
function depthOf(values: Float64Array): number {
  const depth = values[1] as number;
  if (!Number.isNaN(depth)) return depth;
  const ele = values[0] as number;
  return Number.isNaN(ele) ? Number.NaN : -ele + 0;
}

/**
 * The slots of a point's leaf elements by name (`SLOT_*` or an index into `OPTIONAL_KEYS`), the way
 * `close` sorts them, remembered by position: a log repeats the same leaves point after point (and
 * the scanner hands on the same name strings while the points keep one shape).
 */
class LeafSlots {
  readonly #names: string[] = [];
  readonly #slots: number[] = [];

  /** The slot of leaf `k` of the point, named `name`. */
  slotOf(k: number, name: string): number {
    if (this.#names[k] === name) return this.#slots[k] as number;
    const slot = leafSlot(localName(name));
    this.#names[k] = name;
    this.#slots[k] = slot;
    return slot;
  }
}

/** Where a point's leaf element with local name `local` goes, as `close` decides for a track or route point. */
function leafSlot(local: string): number {
  if (local === 'trkpt' || local === 'rtept' || local === 'wpt') return SLOT_DECLINE;
  if (local === 'ele') return 0;
  if (local === 'time') return SLOT_TIME;
  // `name`, `desc` and `fix` are kept for waypoints only
  if (local === 'name' || local === 'desc' || local === 'fix') return SLOT_IGNORED;
  const key = extensionKey(local);
  return key === undefined ? SLOT_IGNORED : OPTIONAL_KEYS.indexOf(key);
}

/** The events after the last element: notes on routes and doubtful elevations, then the row count. */
function* finishGpx(state: GpxHandlers): Generator<ReadEvent> {
  const { trackStats, rowCount, version } = state;
  if (trackStats.some((t) => t.isRoute))
    yield { kind: 'note', text: 'routes are read as tracks without times (planned lines, not logged fixes)' };
  for (const t of trackStats) {
    if (
      !t.isRoute &&
      t.eleCount > 0 &&
      t.elePositive === t.eleCount &&
      t.role === 'vehicle' &&
      decideGpxDepthSign(t, trackStats).doubtful
    ) {
      yield {
        kind: 'note',
        text: `track "${t.name ?? '(unnamed)'}": every <ele> is positive (above the surface) although the track looks underwater; depth kept as -ele, check the log`,
      };
    }
  }
  const dialect = version === '1.0' ? 'gpx-1.0' : version === '1.1' ? 'gpx-1.1' : `gpx-${version || 'unknown-version'}`;
  yield { kind: 'end', rowCount, dialect };
}

function decideGpxDepthSign(track: TrackStats, all: readonly TrackStats[]): DepthSignDecision {
  if (track.depthCount > 0)
    return {
      rule: 'depth',
      doubtful: false,
      reason: 'depth read from a depth extension element, metres positive down',
    };
  if (track.eleCount === 0) return { rule: 'none', doubtful: false, reason: 'the track has no <ele> or depth values' };
  const positive = track.elePositive === track.eleCount;
  const label = `${track.name ?? ''} ${track.type ?? ''}`;
  const underwaterEvidence =
    track.role === 'vehicle' && (UNDERWATER_HINT.test(label) || all.some((t) => t !== track && t.role === 'surface'));
  if (positive && underwaterEvidence) {
    return {
      rule: 'negated-elevation',
      doubtful: true,
      reason:
        'depth = -ele, but every <ele> is positive while the track is a vehicle underwater: the log may have written depth into <ele>',
    };
  }
  return {
    rule: 'negated-elevation',
    doubtful: false,
    reason: 'depth = -ele (GPX elevation is metres above the geoid/surface)',
  };
}

const EXTENSION_NAMES: ReadonlyArray<readonly [RegExp, OptionalKey]> = [
  [DEPTH_NAMES, 'depth'],
  [HEADING_NAMES, 'heading'],
  [SPEED_NAMES, 'speed'],
  [RANGE_NAMES, 'range'],
  [BEARING_NAMES, 'bearing'],
  [QUALITY_NAMES, 'quality'],
  [SURFACE_LAT_NAMES, 'surfaceLat'],
  [SURFACE_LON_NAMES, 'surfaceLon'],
  [SURFACE_HEADING_NAMES, 'surfaceHeading'],
];
/** Extension element names already matched against `EXTENSION_NAMES` (a log repeats a handful of names per point). */
const extensionKeys = new Map<string, OptionalKey | null>();

/** The point value an extension element (by local name) holds, or `undefined` for one the reader does not use. */
function extensionKey(local: string): OptionalKey | undefined {
  let key = extensionKeys.get(local);
  if (key === undefined) {
    key = EXTENSION_NAMES.find(([pattern]) => pattern.test(local))?.[1] ?? null;
    if (extensionKeys.size < 1024) extensionKeys.set(local, key);
  }
  return key ?? undefined;
}

function localName(name: string): string {
  const at = name.indexOf(':');
  return at < 0 ? name : name.slice(at + 1);
}

/** Reads a whole GPX log into tracks, waypoints and rejections; see `readGpxEvents`. Does not validate (see `validateGpx`). */
export function readGpx(input: LogInput, options: ReadOptions = {}): LogReadResult {
  const decoded = decodeLogText(input.fileName, input.content);
  if (!decoded.ok) return refusedLog('gpx', decoded.rejection);
  const forbidden = findForbiddenXml(input.fileName, decoded.text);
  if (forbidden !== undefined) return refusedLog('gpx', forbidden);
  const result = collectReadEvents(readGpxEvents({ fileName: input.fileName, chunks: [decoded.text] }, options), {
    fileName: input.fileName,
    format: 'gpx',
    timeZone: 'UTC',
  });
  if (decoded.encoding !== 'utf-8') result.notes.unshift(`decoded as ${decoded.encoding.toUpperCase()}`);
  return result;
}
