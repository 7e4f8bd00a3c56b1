import type { RejectionCode } from '../model/rejection.js';
import type { TrackRole } from '../model/track.js';
import { MPS_PER_KNOT, normaliseAzimuthDeg } from '../model/units.js';
import { collectReadEvents } from './collect-read-events.js';
import { decodeLogText } from './decode-log-text.js';
import type { LogInput, LogReadResult, ReadOptions } from './log-read-result.js';
import { EARLIEST_TIME_MS, LATEST_TIME_MS, LogTimeParser } from './parse-log-time.js';
import { type LogTextInput, refusedLog } from './read-csv.js';
import type { FixBatch, ReadEvent } from './read-event.js';
import { MAX_LINE_CHARS, pullLogLines } from './split-log-lines.js';

const DAY_MS = 86_400_000;
const HALF_DAY_MS = 43_200_000;
/** Epochs held while waiting for the first date (RMC or ZDA); beyond this they are rejected `no-date`. */
const MAX_UNDATED_EPOCHS = 100_000;
/** NMEA 0183 limit: 82 characters including `$` and CR LF (NMEA Revealed, E. S. Raymond). */
const NMEA_MAX_SENTENCE = 82;

/** One fix being assembled from the sentences of one time of day; `NaN` where a value is missing. */
interface Epoch {
  todMs: number;
  line: number;
  /** UTC ms of 00:00 of the epoch's date, when an RMC in the epoch gave it, else `NaN`. */
  dayMs: number;
  latDeg: number;
  lonDeg: number;
  depthM: number;
  headingDeg: number;
  speedMps: number;
  quality: number;
}

function newEpoch(): Epoch {
  const nan = Number.NaN;
  return {
    todMs: 0,
    line: 0,
    dayMs: nan,
    latDeg: nan,
    lonDeg: nan,
    depthM: nan,
    headingDeg: nan,
    speedMps: nan,
    quality: nan,
  };
}

/** Fixes per `fix-batch` event. */
const NMEA_BATCH_SIZE = 4096;

function newNmeaBatch(): FixBatch {
  const column = () => new Float64Array(NMEA_BATCH_SIZE);
  return {
    count: 0,
    lines: new Uint32Array(NMEA_BATCH_SIZE),
    columns: {
      timeMs: column(),
      latDeg: column(),
      lonDeg: column(),
      depthM: column(),
      headingDeg: column(),
      speedMps: column(),
      quality: column(),
    },
  };
}

// Sentence kinds told apart without copying the address.
const OTHER = 1;
const GGA = 2;
const RMC = 3;

const HDT = 4;
const VTG = 5;
const ZDA = 6;
const HDG = 7;

/** The sentence type (any letter case) from the last three bytes of the address ending at `end`, else OTHER. */
function sentenceKind(bytes: Uint8Array, end: number): number {
  const a = (bytes[end - 3] as number) | 32;
  const b = (bytes[end - 2] as number) | 32;
  const c = (bytes[end - 1] as number) | 32;
  if (a === 103 && b === 103 && c === 97) return GGA; // g g a
  if (a === 122 && b === 100 && c === 97) return ZDA; // z d a
  if (a === 104 && b === 100 && c === 116) return HDT; // h d t
  if (a === 114 && b === 109 && c === 99) return RMC; // r m c
  if (a === 118 && b === 116 && c === 103) return VTG; // v t g
  if (a === 104 && b === 100 && c === 103) return HDG; // h d g
  return OTHER;
}

/**
 * XOR of the characters between the start delimiter (`$` or `!`) and `*`, as two upper-case hex
 * digits (NMEA Revealed, E. S. Raymond, checksum rule).
 */
export function computeNmeaChecksum(body: string): string {
  let x = 0;
  for (let i = 0; i < body.length; i++) x ^= body.charCodeAt(i);
  return x.toString(16).toUpperCase().padStart(2, '0');
}

/**
 * Streams an NMEA 0183 log as read events. GGA and RMC sentences with the same time of day make
 * one fix (position, quality, speed); VTG (speed), HDT (true heading) and HDG (magnetic heading
 * plus deviation and variation) merge into the current fix; ZDA and RMC carry the date, which
 * rolls over at midnight when the time of day goes back by more than 12 hours. Fixes before the
 * first date wait for it (and are dated backwards across midnight when needed). Any talker ID is
 * accepted; truncated trailing fields are read as empty. Depth is the negated GGA altitude.
 * Rejections: `bad-checksum`, `unsupported-sentence` (a line that is not a sentence),
 * `no-fix` (GGA quality 0, RMC status V, empty position), `unparsable-coordinate`,
 * `unparsable-time`, `no-date`, `time-out-of-range`, `line-too-long`. Sentences merged into a fix
 * and other sentence types are non-fix rows, handed on as counts (`non-fix-rows`), not an event
 * each; fixes come in batches (`fix-batch`).
 */
export function* readNmeaEvents(input: LogTextInput, options: ReadOptions = {}): Generator<ReadEvent> {
  const file = input.fileName;
  const times = new LogTimeParser('UTC');
  const role: TrackRole = options.role ?? (/surface|ship|vessel|boat/i.test(file) ? 'surface' : 'vehicle');
  const capacityHint = estimateFixCount(input.chunks);
  yield capacityHint === undefined ? { kind: 'track', role } : { kind: 'track', role, capacityHint };
  let rowCount = 0;
  let dayMs: number | undefined; // 00:00 UTC of the current date
  let lastTodMs: number | undefined;
  /** The open epoch, reused (one shape, no object per fix); `open` says whether it holds one. */
  const current: Epoch = newEpoch();
  let open = false;
  // heading and speed (VTG, HDT, HDG) that came before the first epoch; NaN when none
  let extraHeadingDeg = Number.NaN;
  let extraSpeedMps = Number.NaN;
  const undated: Epoch[] = [];
  const unused = new Map<string, number>();
  let withoutChecksum = 0;
  let overLength = 0;
  let altitudes = 0;
  let positiveAltitudes = 0;
  let magneticWithoutVariation = 0;
  /** Rows merged into a fix or not used, not yet handed on (as one `non-fix-rows` event). */
  let nonFixRows = 0;
  const reject = (line: number, code: RejectionCode, expected: string, found: string, column?: number): ReadEvent => ({
    kind: 'rejection',
    rejection:
      column === undefined ? { file, line, code, expected, found } : { file, line, column, code, expected, found },
  });
  // Fixes go out column by column in batches; every other event first hands on the batch gathered
  // so far, so events keep the order they had one fix at a time.
  let batch = newNmeaBatch();
  /** The batch is already queued in `out`: a further fix starts a new one. */
  let sealed = false;
  /** Events made by the helpers below, handed on after each sentence (plain functions: no generator per sentence). */
  const out: ReadEvent[] = [];
  const pushEvent = (event: ReadEvent): void => {
    if (batch.count > 0 && !sealed) {
      out.push({ kind: 'fix-batch', batch });
      sealed = true;
    }
    out.push(event);
  };
  const addFix = (epoch: Epoch, timeMs: number): void => {
    if (sealed) {
      batch = newNmeaBatch();
      sealed = false;
    }
    const i = batch.count;
    const c = batch.columns;
    (c.timeMs as Float64Array)[i] = timeMs;
    (c.latDeg as Float64Array)[i] = epoch.latDeg;
    (c.lonDeg as Float64Array)[i] = epoch.lonDeg;
    (c.depthM as Float64Array)[i] = epoch.depthM;
    (c.headingDeg as Float64Array)[i] = epoch.headingDeg;
    (c.speedMps as Float64Array)[i] = epoch.speedMps;
    (c.quality as Float64Array)[i] = epoch.quality;
    batch.lines[i] = epoch.line;
    batch.count = i + 1;
    if (batch.count === NMEA_BATCH_SIZE) {
      out.push({ kind: 'fix-batch', batch });
      sealed = true;
    }
  };
  /** Dates an epoch from the carried date, rolling over at midnight. */
  const dateEpoch = (epoch: Epoch): void => {
    if (!Number.isNaN(epoch.dayMs)) {
      dayMs = epoch.dayMs;
    } else if (dayMs !== undefined && lastTodMs !== undefined && epoch.todMs < lastTodMs - HALF_DAY_MS) {
      dayMs += DAY_MS; // midnight passed since the last dated sentence
    } else if (dayMs !== undefined && lastTodMs !== undefined && epoch.todMs > lastTodMs + HALF_DAY_MS) {
      dayMs -= DAY_MS; // a late sentence from before midnight
    }
    lastTodMs = epoch.todMs;
    emitEpoch(epoch, dayMs as number);
  };
  const emitEpoch = (epoch: Epoch, day: number): void => {
    const timeMs = day + epoch.todMs;
    if (timeMs >= EARLIEST_TIME_MS && timeMs < LATEST_TIME_MS) {
      addFix(epoch, timeMs);
      return;
    }
    const t = times.acceptUtc(timeMs);
    if (!t.ok) {
      pushEvent(reject(epoch.line, t.code, t.expected, new Date(day + epoch.todMs).toISOString()));
      return;
    }
    addFix(epoch, t.timeMs);
  };
  // A ZDA's date: the open fix is finished first; fixes still waiting for a date take it (the day
  // before when their time of day lies more than half a day after the ZDA's); later fixes follow it.
  const setDate = (day: number, tod: number): void => {
    flush();
    if (undated.length > 0) {
      for (const u of undated) emitEpoch(u, u.todMs > tod + HALF_DAY_MS ? day - DAY_MS : day);
      undated.length = 0;
    }
    dayMs = day;
    lastTodMs = tod;
  };
  const flush = (): void => {
    if (!open) return;
    open = false;
    const epoch = current;
    if (dayMs === undefined && Number.isNaN(epoch.dayMs)) {
      if (undated.length >= MAX_UNDATED_EPOCHS) {
        pushEvent(reject(epoch.line, 'no-date', 'a date from an RMC or ZDA sentence before this fix', 'no date yet'));
        return;
      }
      undated.push({ ...epoch });
      return;
    }
    if (undated.length > 0) {
      const firstDay = Number.isNaN(epoch.dayMs) ? (dayMs as number) : epoch.dayMs;
      const anchorTod = epoch.todMs;
      for (const u of undated) emitEpoch(u, u.todMs > anchorTod + HALF_DAY_MS ? firstDay - DAY_MS : firstDay);
      undated.length = 0;
    }
    dateEpoch(epoch);
  };
  /** Starts the epoch at `todMs` with this position, or joins the open one of the same time (keeping its position). */
  const joinEpoch = (todMs: number, line: number, latDeg: number, lonDeg: number): Epoch => {
    if (open && current.todMs === todMs) {
      nonFixRows++; // merged into the fix of the same time
      return current;
    }
    flush();
    current.todMs = todMs;
    current.line = line;
    current.dayMs = Number.NaN;
    current.latDeg = latDeg;
    current.lonDeg = lonDeg;
    current.depthM = Number.NaN;
    current.headingDeg = extraHeadingDeg;
    current.speedMps = extraSpeedMps;
    current.quality = Number.NaN;
    extraHeadingDeg = Number.NaN;
    extraSpeedMps = Number.NaN;
    open = true;
    return current;
  };
  /** Merges a heading into the open epoch, or keeps it for the next one; NaN is ignored. */
  const attachHeading = (headingDeg: number): void => {
    if (Number.isNaN(headingDeg)) return;
    if (open) current.headingDeg = headingDeg;
    else extraHeadingDeg = headingDeg;
  };
  const attachSpeed = (speedMps: number): void => {
    if (Number.isNaN(speedMps)) return;
    if (open) current.speedMps = speedMps;
    else extraSpeedMps = speedMps;
  };
  const fields = new NmeaFields();
  /** A line's characters as bytes, for lines read the general way. */
  const lineBytes = new LineBytes();
  /**
   * A GGA that makes or joins a fix without any finding; false, having changed nothing, otherwise
   * (`rejectGga` then says why).
   */
  const readGga = (b: Uint8Array, line: number): boolean => {
    const tod = parseTimeOfDayIn(b, fields.start(1), fields.end(1));
    if (tod === undefined) return false;
    const quality = fields.number(6);
    if (quality === 0) return false;
    const lat = parseNmeaCoordinateIn(b, fields.start(2), fields.end(2), fields.letter(3), 2);
    if (lat === undefined) return false;
    const lon = parseNmeaCoordinateIn(b, fields.start(4), fields.end(4), fields.letter(5), 3);
    if (lon === undefined) return false;
    const epoch = joinEpoch(tod, line, lat, lon);
    if (!Number.isNaN(quality)) epoch.quality = quality;
    const altitude = fields.number(9);
    if (Number.isFinite(altitude)) {
      epoch.depthM = -altitude + 0;
      altitudes++;
      if (altitude > 0) positiveAltitudes++;
    }
    return true;
  };
  /** An RMC that makes or joins a fix without any finding; false, having changed nothing, otherwise. */
  const readRmc = (b: Uint8Array, line: number): boolean => {
    const tod = parseTimeOfDayIn(b, fields.start(1), fields.end(1));
    if (tod === undefined || fields.letter(2) !== 65 /* A */) return false;
    const day = parseNmeaDateIn(b, fields.start(9), fields.end(9));
    if (day === undefined && !fields.isEmpty(9)) return false;
    const lat = parseNmeaCoordinateIn(b, fields.start(3), fields.end(3), fields.letter(4), 2);
    if (lat === undefined) return false;
    const lon = parseNmeaCoordinateIn(b, fields.start(5), fields.end(5), fields.letter(6), 3);
    if (lon === undefined) return false;
    const epoch = joinEpoch(tod, line, lat, lon);
    if (day !== undefined) epoch.dayMs = day;
    const sog = fields.number(7);
    if (!Number.isNaN(sog) && Number.isNaN(epoch.speedMps)) epoch.speedMps = sog * MPS_PER_KNOT;
    return true;
  };
  /**
   * Reads one line the general way: trimmed, the sentence found after any leading text, its
   * characters copied as bytes. Events go to `out` (handed on after the line); rows merged into a
   * fix or not used are only counted in `nonFixRows`, so they never break a batch of fixes.
   */
  const readLine = (src: string, start: number, end: number, line: number, tooLongChars: number): void => {
    if (tooLongChars >= 0) {
      rowCount++;
      pushEvent(
        reject(line, 'line-too-long', 'an NMEA sentence of at most 82 characters', `${tooLongChars} characters`),
      );
      return;
    }
    let from = start;
    let to = end;
    // trim white space at both ends without copying
    while (from < to && src.charCodeAt(from) <= 32) from++;
    while (to > from && src.charCodeAt(to - 1) <= 32) to--;
    if (from === to) return;
    rowCount++;
    let at = src.charCodeAt(from) === 36 ? from : src.indexOf('$', from);
    if (at < 0 || at >= to) at = src.indexOf('!', from);
    if (at < 0 || at >= to) {
      pushEvent(
        reject(
          line,
          'unsupported-sentence',
          'an NMEA 0183 sentence ($, talker ID, sentence type, fields)',
          quote(src.slice(from, to)),
        ),
      );
      return;
    }
    const ascii = lineBytes.load(src, at, to);
    fields.scanLine(lineBytes, at + 1);
    // a character beyond ASCII was copied as 255: the checksum is over the characters themselves
    const x = ascii ? fields.checksum : xorOf(src, at + 1, fields.star >= 0 ? fields.star + lineBytes.base : to);
    readSentence(src, start, at, to, line, x);
  };
  /**
   * One sentence from its `$` or `!` at `at` to `to` (trimmed, text positions) on the line starting
   * at `lineStart`, its fields scanned into `fields` and `x` the XOR of its body. Fields are read in
   * place from `fields.bytes`, copied only for messages.
   */
  const readSentence = (src: string, lineStart: number, at: number, to: number, line: number, x: number): void => {
    if (to - at + 2 > NMEA_MAX_SENTENCE) overLength++;
    const b = fields.bytes;
    const base = fields.base;
    const star = fields.star;
    if (star >= 0) {
      if (hexByteAt(b, star + 1, to - base) !== x) {
        pushEvent(
          reject(
            line,
            'bad-checksum',
            `checksum ${HEX[(x >> 4) & 15]}${HEX[x & 15]} (XOR of the characters between $ and *)`,
            `*${src.slice(base + star + 1, to)}`,
            base + star - lineStart + 1,
          ),
        );
        return;
      }
    } else {
      withoutChecksum++;
    }
    const addressStart = fields.start(0);
    const addressEnd = fields.end(0);
    if (b[at - base] === 33 || addressEnd - addressStart < 5 || b[addressStart] === 80 /* P: proprietary */) {
      const address = fields.get(0);
      unused.set(address, (unused.get(address) ?? 0) + 1);
      nonFixRows++;
      return;
    }
    const kind = sentenceKind(b, addressEnd);
    if (kind === GGA) {
      if (!readGga(b, line)) rejectGga(b, line);
      return;
    }
    if (kind === RMC) {
      if (!readRmc(b, line)) rejectRmc(b, line);
      return;
    }
    if (kind === HDT) {
      const heading = fields.number(1);
      if (!Number.isNaN(heading)) attachHeading(normaliseAzimuthDeg(heading));
      nonFixRows++;
      return;
    }
    if (kind === VTG) {
      // Older form `$--VTG,x.x,x,x.x,x.x`: field 2 is not the literal T (NMEA Revealed, VTG).
      const newer = fields.letter(2) === 84 || fields.isEmpty(2);
      const knots = fields.number(newer ? 5 : 3);
      const kmh = fields.number(newer ? 7 : 4);
      attachSpeed(!Number.isNaN(knots) ? knots * MPS_PER_KNOT : !Number.isNaN(kmh) ? kmh / 3.6 : Number.NaN);
      nonFixRows++;
      return;
    }
    if (kind === HDG) {
      readHdg();
      nonFixRows++;
      return;
    }
    if (kind === ZDA) {
      readZda(src, b, at, to, line);
      return;
    }
    const type = src.slice(base + addressEnd - 3, base + addressEnd).toUpperCase();
    unused.set(type, (unused.get(type) ?? 0) + 1);
    nonFixRows++;
  };
  /**
   * Why `readGga` declined a GGA whose checksum is good (it takes every GGA with a time, a fix and
   * a position, so one of them is wrong here): the rejection.
   */
  const rejectGga = (b: Uint8Array, line: number): void => {
    const tod = parseTimeOfDayIn(b, fields.start(1), fields.end(1));
    const quality = fields.number(6);
    const lat = parseNmeaCoordinateIn(b, fields.start(2), fields.end(2), fields.letter(3), 2);
    if (tod === undefined) {
      pushEvent(reject(line, 'unparsable-time', 'a UTC time of day hhmmss.ss in GGA field 1', quote(fields.get(1)), 2));
      return;
    }
    if (quality === 0 || fields.isEmpty(2) || fields.isEmpty(4)) {
      pushEvent(
        reject(
          line,
          'no-fix',
          'a GGA position with fix quality 1-8',
          quality === 0 ? 'quality 0 (no fix)' : 'an empty position',
        ),
      );
      return;
    }
    pushEvent(
      reject(
        line,
        'unparsable-coordinate',
        lat === undefined ? 'latitude ddmm.mmmm with N or S' : 'longitude dddmm.mmmm with E or W',
        quote(lat === undefined ? `${fields.get(2)},${fields.get(3)}` : `${fields.get(4)},${fields.get(5)}`),
      ),
    );
  };
  /**
   * Why `readRmc` declined an RMC whose checksum is good (it takes every RMC with a time, status A,
   * a position and a valid or empty date): the rejection. A void RMC may still set the date.
   */
  const rejectRmc = (b: Uint8Array, line: number): void => {
    const tod = parseTimeOfDayIn(b, fields.start(1), fields.end(1));
    const day = parseNmeaDateIn(b, fields.start(9), fields.end(9));
    const active = fields.letter(2) === 65; /* A */
    const lat = parseNmeaCoordinateIn(b, fields.start(3), fields.end(3), fields.letter(4), 2);
    const lon = parseNmeaCoordinateIn(b, fields.start(5), fields.end(5), fields.letter(6), 3);
    if (tod === undefined) {
      pushEvent(reject(line, 'unparsable-time', 'a UTC time of day hhmmss.ss in RMC field 1', quote(fields.get(1)), 2));
      return;
    }
    if (!active || fields.isEmpty(3) || fields.isEmpty(5)) {
      if (day !== undefined && !open) {
        dayMs = day;
        lastTodMs = tod;
      }
      pushEvent(
        reject(
          line,
          'no-fix',
          'an RMC with status A and a position',
          fields.get(2) === 'V' ? 'status V (warning, no valid fix)' : 'an empty position',
        ),
      );
      return;
    }
    if (lat === undefined || lon === undefined) {
      pushEvent(
        reject(
          line,
          'unparsable-coordinate',
          lat === undefined ? 'latitude ddmm.mmmm with N or S' : 'longitude dddmm.mmmm with E or W',
          quote(lat === undefined ? `${fields.get(3)},${fields.get(4)}` : `${fields.get(5)},${fields.get(6)}`),
        ),
      );
      return;
    }
    pushEvent(reject(line, 'unparsable-time', 'an RMC date ddmmyy in field 9', quote(fields.get(9)), 10));
  };
  /**
   * HDG: magnetic heading plus deviation and variation, each a number with E or W. Fields are read
   * in place; a field that is empty, not a number or not finite leaves the heading unused, as
   * `Number` on the copied field did.
   */
  const readHdg = (): void => {
    const magnetic = fields.number(1);
    if (Number.isNaN(magnetic)) return;
    if (fields.isEmpty(4)) {
      magneticWithoutVariation++;
      return;
    }
    const deviation = fields.isEmpty(2) ? 0 : fields.number(2) * (fields.letter(3) === 87 /* W */ ? -1 : 1);
    // true = magnetic + deviation + variation, east positive (NMEA HDG; from memory)
    const variation = fields.number(4) * (fields.letter(5) === 87 /* W */ ? -1 : 1);
    const heading = magnetic + deviation + variation;
    if (Number.isFinite(heading)) attachHeading(normaliseAzimuthDeg(heading));
  };
  /** ZDA: the date for the fixes around it, or an `unparsable-time` rejection. */
  const readZda = (src: string, b: Uint8Array, at: number, to: number, line: number): void => {
    const tod = parseTimeOfDayIn(b, fields.start(1), fields.end(1));
    // the usual form (two-digit day and month, four-digit year) read in place
    const d = fields.end(2) - fields.start(2) === 2 ? twoDigits(b, fields.start(2)) : -1;
    const m = fields.end(3) - fields.start(3) === 2 ? twoDigits(b, fields.start(3)) : -1;
    const y4 = fields.start(4);
    const y =
      fields.end(4) - y4 === 4 && twoDigits(b, y4) >= 0 && twoDigits(b, y4 + 2) >= 0
        ? twoDigits(b, y4) * 100 + twoDigits(b, y4 + 2)
        : -1;
    if (tod !== undefined && d >= 1 && d <= 31 && m >= 1 && m <= 12 && y >= 0) {
      nonFixRows++;
      setDate(utcDayMs(y, m, d), tod);
      return;
    }
    // anything else (one-digit day, white space around numbers) as `Number` reads it
    const dn = Number(fields.get(2));
    const mn = Number(fields.get(3));
    const yn = Number(fields.get(4));
    const valid = tod !== undefined && /^\d{4}$/.test(fields.get(4)) && dn >= 1 && dn <= 31 && mn >= 1 && mn <= 12;
    if (!valid) {
      pushEvent(
        reject(line, 'unparsable-time', 'a ZDA with hhmmss.ss, day, month and 4-digit year', quote(src.slice(at, to))),
      );
      return;
    }
    nonFixRows++;
    setDate(Date.UTC(yn, mn - 1, dn), tod);
  };
  /** Hands on the events of the lines read so far (`out`), a count of non-fix rows first. */
  const handOn = function* (): Generator<ReadEvent> {
    if (nonFixRows > 0) {
      yield { kind: 'non-fix-rows', count: nonFixRows };
      nonFixRows = 0;
    }
    for (let k = 0; k < out.length; k++) yield out[k] as ReadEvent;
    out.length = 0;
    if (sealed) {
      // the consumer has moved past the queued batch: its arrays can be filled again
      batch.count = 0;
      sealed = false;
    }
  };
  /**
   * Reads the line of `text` starting at `pos` and returns where the next one starts (after its CR,
   * LF or CRLF). A line that starts with `$` is found while its fields are scanned, in one pass
   * over the bytes of `window`; one that does not, ends in white space, is not ASCII or is longer
   * than the window goes the general way (`readLine`), with the same lines as `pullLogLines`.
   */
  const readTextLine = (text: string, window: AsciiWindow, pos: number, line: number): number => {
    let end = -1;
    if (window.charAt(pos) === 36) {
      end = fields.scanLine(window, pos + 1);
      if (end < 0 && window.moveTo(pos)) end = fields.scanLine(window, pos + 1);
      if (end >= 0 && window.charAt(end - 1) > 32) {
        rowCount++;
        readSentence(text, pos, pos, end, line, fields.checksum);
      } else end = -1;
    }
    if (end < 0) {
      end = findLineEnd(text, pos, text.length);
      const length = end - pos;
      readLine(text, pos, end, line, length > MAX_LINE_CHARS ? length : -1);
    }
    return end + (window.charAt(end) === 13 && window.charAt(end + 1) === 10 ? 2 : 1);
  };
  const whole = wholeText(input.chunks);
  if (whole !== undefined) {
    const n = whole.length;
    const window = new AsciiWindow(whole);
    let line = 0;
    for (let pos = 0; pos < n; ) {
      line++;
      pos = readTextLine(whole, window, pos, line);
      if (out.length > 0) yield* handOn();
    }
  } else {
    const pullLine = pullLogLines(input.chunks);
    for (let c = pullLine(); c !== undefined; c = pullLine()) {
      readLine(c.source, c.start, c.end, c.line, c.tooLongChars);
      if (out.length > 0) yield* handOn();
    }
  }
  flush();
  for (let k = 0; k < out.length; k++) yield out[k] as ReadEvent;
  out.length = 0;
  if (!sealed && batch.count > 0) yield { kind: 'fix-batch', batch };
  if (nonFixRows > 0) yield { kind: 'non-fix-rows', count: nonFixRows };
  for (const u of undated)
    yield reject(u.line, 'no-date', 'a date from an RMC or ZDA sentence somewhere in the log', 'none in the whole log');
  undated.length = 0;
  if (unused.size > 0)
    yield { kind: 'note', text: `sentences not used: ${[...unused].map(([k, v]) => `${k} x${v}`).join(', ')}` };
  if (withoutChecksum > 0)
    yield { kind: 'note', text: `${withoutChecksum} sentences had no checksum and were read unchecked` };
  if (overLength > 0)
    yield {
      kind: 'note',
      text: `${overLength} sentences are longer than the 82 characters NMEA 0183 allows; read anyway`,
    };
  if (magneticWithoutVariation > 0)
    yield {
      kind: 'note',
      text: `${magneticWithoutVariation} HDG sentences had no magnetic variation: their magnetic heading was not used`,
    };
  const doubtful = role === 'vehicle' && altitudes > 0 && positiveAltitudes === altitudes;
  yield {
    kind: 'depth-sign',
    decision:
      altitudes === 0
        ? { rule: 'none', doubtful: false, reason: 'no GGA altitudes' }
        : {
            rule: 'negated-elevation',
            doubtful,
            reason: doubtful
              ? 'depth = -GGA altitude, but every altitude is positive for a vehicle track: these may be antenna heights, not depths'
              : 'depth = -GGA altitude above mean sea level',
          },
  };
  yield { kind: 'end', rowCount, dialect: 'nmea-0183' };
}

/** The text when it comes as one string, else `undefined`. */
function wholeText(chunks: Iterable<string>): string | undefined {
  const text = Array.isArray(chunks) && chunks.length === 1 ? (chunks[0] as unknown) : undefined;
  return typeof text === 'string' ? text : undefined;
}

/** Index of the first CR or LF in `text` from `from` (before `n`), else `n`. */
function findLineEnd(text: string, from: number, n: number): number {
  for (let i = from; i < n; i++) {
    const c = text.charCodeAt(i);
    if (c === 10 || c === 13) return i;
  }
  return n;
}

/**
 * Fixes in a log given as one string, estimated from its first 64 KiB: a fix is one time of day
 * with a GGA, an RMC or both (upper-case addresses; an estimate only sizes the track's columns).
 * `undefined` for chunked text or when the sample holds neither.
 */
function estimateFixCount(chunks: Iterable<string>): number | undefined {
  const text = wholeText(chunks);
  if (text === undefined) return undefined;
  const sample = text.slice(0, 65_536);
  const count = (word: string): number => {
    let n = 0;
    for (let at = sample.indexOf(word); at >= 0; at = sample.indexOf(word, at + 1)) n++;
    return n;
  };
  const fixes = Math.max(count('GGA,'), count('RMC,'));
  if (fixes === 0) return undefined;
  return sample.length === text.length ? fixes : Math.ceil((text.length / sample.length) * fixes * 1.02);
}

const HEX = '0123456789ABCDEF';

function hexDigit(code: number): number {
  if (code >= 48 && code <= 57) return code - 48;
  if (code >= 65 && code <= 70) return code - 55;
  if (code >= 97 && code <= 102) return code - 87;
  return -1;
}

/** The two hex digits at `at` as a byte, or -1 when they are not two hex digits before `end`. */
function hexByteAt(bytes: Uint8Array, at: number, end: number): number {
  if (at + 2 > end) return -1;
  const high = hexDigit(bytes[at] as number);
  const low = hexDigit(bytes[at + 1] as number);
  return high < 0 || low < 0 ? -1 : high * 16 + low;
}

/** XOR of the characters of `text` from `start` to `end` (for a sentence with characters beyond ASCII). */
function xorOf(text: string, start: number, end: number): number {
  let x = 0;
  for (let i = start; i < end; i++) x ^= text.charCodeAt(i);
  return x;
}

/**
 * Characters of a text as bytes, so that sentences are scanned and read from a typed array (several
 * times faster than `charCodeAt`): `bytes[k]` is the character at text position `base + k`, for
 * `base + k < limit`; a line that reaches `limit` before `stop` goes on past the bytes held.
 */
interface TextBytes {
  readonly text: string;
  readonly bytes: Uint8Array;
  readonly base: number;
  readonly limit: number;
  readonly stop: number;
}

/** Characters of the window over the text that `NmeaFields.scanLine` reads as bytes. */
const WINDOW_CHARS = 65_536;

/**
 * Part of an ASCII text as bytes, one per character. Turns itself off for good at the first
 * character that is not ASCII; the reader then takes the general way (`LineBytes`).
 */
class AsciiWindow implements TextBytes {
  readonly text: string;
  readonly bytes: Uint8Array;
  base = 0;
  limit = 0;
  readonly stop: number;
  #off = false;
  readonly #encoder = new TextEncoder();

  constructor(text: string) {
    this.text = text;
    this.stop = text.length;
    this.bytes = new Uint8Array(Math.min(WINDOW_CHARS, text.length));
  }

  /** The character code at text position `pos` (from the bytes when they hold it), `NaN` past the end. */
  charAt(pos: number): number {
    return pos >= this.base && pos < this.limit ? (this.bytes[pos - this.base] as number) : this.text.charCodeAt(pos);
  }

  /** Moves the window to start at `pos`; false when that gains nothing (already there) or the text is not ASCII. */
  moveTo(pos: number): boolean {
    if (this.#off || (pos === this.base && this.limit > pos)) return false;
    const { read, written } = this.#encoder.encodeInto(this.text.slice(pos, pos + WINDOW_CHARS), this.bytes);
    if (read !== written) {
      // a character took more than one byte: positions in `bytes` are no longer the text's
      this.#off = true;
      this.limit = 0;
      return false;
    }
    this.base = pos;
    this.limit = pos + read;
    return true;
  }
}

/**
 * One line's characters as bytes, for lines read the general way; a character beyond ASCII becomes
 * 255, which no rule of a sentence matches (as the character itself would not).
 */
class LineBytes implements TextBytes {
  text = '';
  bytes = new Uint8Array(128);
  base = 0;
  limit = 0;
  stop = 0;

  /** Copies characters `start` to `end` of `text`; whether they were all ASCII. */
  load(text: string, start: number, end: number): boolean {
    if (this.bytes.length < end - start) this.bytes = new Uint8Array(end - start);
    const bytes = this.bytes;
    let ascii = true;
    for (let i = start; i < end; i++) {
      const c = text.charCodeAt(i);
      if (c > 127) ascii = false;
      bytes[i - start] = Math.min(c, 255);
    }
    this.text = text;
    this.base = start;
    this.limit = end;
    this.stop = end;
    return ascii;
  }
}

/** Bytes `start` to `end` as text, one character each. */
function asciiText(bytes: Uint8Array, start: number, end: number): string {
  let text = '';
  for (let i = start; i < end; i++) text += String.fromCharCode(bytes[i] as number);
  return text;
}

/** A short text as bytes (see `LineBytes`), for the exported parsers. */
function bytesOf(text: string): Uint8Array {
  const line = new LineBytes();
  line.load(text, 0, text.length);
  return line.bytes.subarray(0, text.length);
}

/** The comma-separated fields of one sentence body, located in place in bytes; `get` copies one field from the text. */
class NmeaFields {
  #text = '';
  #end = 0;
  #count = 0;
  readonly #starts = new Int32Array(64);
  /** The bytes the positions below index; `base` is the text position of `bytes[0]`. */
  bytes: Uint8Array = new Uint8Array(0);
  base = 0;
  /** Index in `bytes` of the last `*` of the sentence (the checksum delimiter), or -1 when it has none. */
  star = -1;
  /** The XOR of the body (the checksum). */
  checksum = 0;

  /**
   * Finds the fields of the sentence from text position `start` (after `$`) to the first CR or LF
   * (or `source.stop`) in one pass; the body ends at the last `*` when there is one. Returns the
   * text position where the sentence ends, with the body's XOR in `checksum`; -1 when the bytes
   * held end first (nothing is changed then).
   */
  scanLine(source: TextBytes, start: number): number {
    const bytes = source.bytes;
    const base = source.base;
    const n = source.limit - base;
    const starts = this.#starts;
    const max = starts.length;
    let count = 1;
    let x = 0;
    let star = -1;
    let xAtStar = 0;
    let countAtStar = 0;
    const first = start - base;
    let k = first;
    for (; k < n; k++) {
      const c = bytes[k] as number;
      // one test for the common characters (digits, letters, `.`, `-`): all above `,`
      if (c <= 44) {
        if (c === 44) {
          if (count < max) starts[count++] = k + 1;
        } else if (c === 42) {
          star = k;
          xAtStar = x;
          countAtStar = count;
        } else if (c === 10 || c === 13) break;
      }
      x ^= c;
    }
    if (k >= n && source.limit < source.stop) return -1;
    this.#text = source.text;
    this.bytes = bytes;
    this.base = base;
    starts[0] = first;
    this.star = star;
    if (star >= 0) {
      this.#end = star;
      this.#count = countAtStar;
      this.checksum = xAtStar;
    } else {
      this.#end = k;
      this.#count = count;
      this.checksum = x;
    }
    return base + k;
  }

  /** Index in `bytes` where field `i` starts (the body's end for a missing field). */
  start(i: number): number {
    return i < this.#count ? (this.#starts[i] as number) : this.#end;
  }

  /** Index in `bytes` just past field `i` (the body's end for a missing field). */
  end(i: number): number {
    return i + 1 < this.#count ? (this.#starts[i + 1] as number) - 1 : this.#end;
  }

  /** The character code of field `i` when it is exactly one character, else -1. */
  letter(i: number): number {
    const start = this.start(i);
    return this.end(i) - start === 1 ? (this.bytes[start] as number) : -1;
  }

  /** Whether field `i` is empty or missing. */
  isEmpty(i: number): boolean {
    if (i >= this.#count) return true;
    const end = i + 1 < this.#count ? (this.#starts[i + 1] as number) - 1 : this.#end;
    return end === this.#starts[i];
  }

  /** Field `i` as a number read in place, `NaN` when empty, missing or not a number. */
  number(i: number): number {
    if (this.isEmpty(i)) return Number.NaN;
    const start = this.#starts[i] as number;
    const end = i + 1 < this.#count ? (this.#starts[i + 1] as number) - 1 : this.#end;
    const fast = parseDecimalIn(this.bytes, start, end);
    if (!Number.isNaN(fast)) return fast;
    // anything else (white space, exponents, over 15 digits) as `Number` reads the field
    const value = Number(this.#text.slice(this.base + start, this.base + end));
    return Number.isFinite(value) ? value : Number.NaN;
  }

  /** Field `i` (0 is the address), `''` beyond the last one (truncated trailing fields). */
  get(i: number): string {
    if (i >= this.#count) return '';
    const start = this.#starts[i] as number;
    const end = i + 1 < this.#count ? (this.#starts[i + 1] as number) - 1 : this.#end;
    return this.#text.slice(this.base + start, this.base + end);
  }
}

/**
 * A plain decimal (`-12.5`, `+3`, `.5`, `7.`) of bytes `start` to `end`, exactly as `Number` reads
 * it: all digits as one integer, divided by a power of ten (both exact up to 15 digits, so the
 * one rounding is the correctly rounded result). `NaN` for anything else and over 15 digits.
 */
function parseDecimalIn(bytes: Uint8Array, start: number, end: number): number {
  let i = start;
  let negative = false;
  const first = bytes[i];
  if (first === 45 || first === 43) {
    negative = first === 45;
    i++;
  }
  let mantissa = 0;
  let c = 0;
  const wholeStart = i;
  for (; i < end; i++) {
    c = bytes[i] as number;
    const d = c - 48;
    if (d < 0 || d > 9) break;
    mantissa = mantissa * 10 + d;
  }
  let digitCount = i - wholeStart;
  let fractionDigits = 0;
  if (i < end && c === 46) {
    const fractionStart = ++i;
    for (; i < end; i++) {
      const d = (bytes[i] as number) - 48;
      if (d < 0 || d > 9) break;
      mantissa = mantissa * 10 + d;
    }
    fractionDigits = i - fractionStart;
    digitCount += fractionDigits;
  }
  if (i < end || digitCount === 0 || digitCount > 15) return Number.NaN;
  const value = fractionDigits > 0 ? mantissa / (POW10[fractionDigits] as number) : mantissa;
  return negative ? -value : value;
}

/** 10^k for k = 0..15, all exact in binary64. */
const POW10 = Array.from({ length: 16 }, (_, k) => 10 ** k);

/** `hhmmss[.ss]` to milliseconds after midnight; `undefined` when malformed. */
export function parseTimeOfDay(text: string): number | undefined {
  return parseTimeOfDayIn(bytesOf(text), 0, text.length);
}

/** `parseTimeOfDay` of bytes `start` to `end`, read in place. */
function parseTimeOfDayIn(bytes: Uint8Array, start: number, end: number): number | undefined {
  const n = end - start;
  if (n < 6 || (n > 6 && (n === 7 || bytes[start + 6] !== 46))) return undefined;
  const h = twoDigits(bytes, start);
  const m = twoDigits(bytes, start + 2);
  const whole = twoDigits(bytes, start + 4);
  if (h < 0 || m < 0 || whole < 0 || h > 23 || m > 59 || whole > 60) return undefined;
  let fractionMs = 0;
  let scale = 100;
  for (let i = start + 7; i < end; i++) {
    const d = (bytes[i] as number) - 48;
    if (d < 0 || d > 9) return undefined;
    fractionMs += d * scale;
    scale /= 10;
  }
  return Math.round((h * 3600 + m * 60 + whole) * 1000 + fractionMs);
}

/** The two digits at `at` as a number, -1 when they are not two digits. */
function twoDigits(bytes: Uint8Array, at: number): number {
  const a = (bytes[at] as number) - 48;
  const b = (bytes[at + 1] as number) - 48;
  return a < 0 || a > 9 || b < 0 || b > 9 ? -1 : a * 10 + b;
}

/** `ddmmyy` to 00:00 UTC ms; two-digit years 80-99 are 19xx, 00-79 are 20xx (common practice for NMEA dates). */
export function parseNmeaDate(text: string): number | undefined {
  return parseNmeaDateIn(bytesOf(text), 0, text.length);
}

/** `parseNmeaDate` of bytes `start` to `end`, read in place. */
function parseNmeaDateIn(bytes: Uint8Array, start: number, end: number): number | undefined {
  if (end - start !== 6) return undefined;
  const d = twoDigits(bytes, start);
  const m = twoDigits(bytes, start + 2);
  const yy = twoDigits(bytes, start + 4);
  if (d < 0 || m < 0 || yy < 0) return undefined;
  if (d < 1 || d > 31 || m < 1 || m > 12) return undefined;
  return utcDayMs(yy >= 80 ? 1900 + yy : 2000 + yy, m, d);
}

// The last day asked of `utcDayMs`: a log's sentences carry the same date for a whole day.
let lastDayKey = -1;
let lastDayMs = 0;

/** `Date.UTC` of 00:00 on day `d` of month `m` (1-12) of year `y` (0-9999), computed once per run of equal days. */
function utcDayMs(y: number, m: number, d: number): number {
  const key = (y * 100 + m) * 100 + d;
  if (key !== lastDayKey) {
    lastDayMs = Date.UTC(y, m - 1, d);
    lastDayKey = key;
  }
  return lastDayMs;
}

/** NMEA `(d)ddmm.mmmm` plus hemisphere letter to signed degrees; `undefined` when malformed or out of range. */
export function parseNmeaCoordinate(value: string, hemisphere: string, axis: 'lat' | 'lon'): number | undefined {
  const letter = hemisphere.length === 1 ? hemisphere.charCodeAt(0) : -1;
  return parseNmeaCoordinateIn(bytesOf(value), 0, value.length, letter, axis === 'lat' ? 2 : 3);
}

/**
 * `parseNmeaCoordinate` of bytes `start` to `end`, read in place, with the hemisphere as one
 * character code (-1 when the field is not one character) and 2 (latitude) or 3 (longitude) degree digits.
 */
function parseNmeaCoordinateIn(
  bytes: Uint8Array,
  start: number,
  end: number,
  hemisphere: number,
  degDigits: number,
): number | undefined {
  const lat = degDigits === 2;
  const south = hemisphere === 83; // S
  const west = hemisphere === 87; // W
  const valid = lat ? hemisphere === 78 || south : hemisphere === 69 || west; // N, E
  // degrees and whole minutes: exactly degDigits + 2 digits before the decimal point, if any
  const wholeEnd = start + degDigits + 2;
  if (!valid || end < wholeEnd) return undefined;
  let deg = 0;
  for (let i = start; i < start + degDigits; i++) {
    const d = (bytes[i] as number) - 48;
    if (d < 0 || d > 9) return undefined;
    deg = deg * 10 + d;
  }
  const m1 = (bytes[wholeEnd - 2] as number) - 48;
  const m2 = (bytes[wholeEnd - 1] as number) - 48;
  if (m1 < 0 || m1 > 9 || m2 < 0 || m2 > 9) return undefined;
  // minutes read in the same pass, as `parseDecimalIn` would: all digits as one integer over 10^fraction digits
  let mantissa = m1 * 10 + m2;
  let fractionDigits = 0;
  if (end > wholeEnd) {
    if (bytes[wholeEnd] !== 46 || end === wholeEnd + 1) return undefined; // `.` and a fraction
    for (let i = wholeEnd + 1; i < end; i++) {
      const d = (bytes[i] as number) - 48;
      if (d < 0 || d > 9) return undefined;
      mantissa = mantissa * 10 + d;
    }
    fractionDigits = end - wholeEnd - 1;
  }
  // over 15 digits the integer is not exact: the minutes as `Number` reads them (digits and `.` only here)
  const min =
    fractionDigits > 13
      ? Number(asciiText(bytes, wholeEnd - 2, end))
      : fractionDigits > 0
        ? mantissa / (POW10[fractionDigits] as number)
        : mantissa;
  if (min >= 60) return undefined;
  const magnitude = deg + min / 60;
  if (magnitude > (lat ? 90 : 180)) return undefined;
  return south || west ? -magnitude : magnitude;
}

function quote(text: string): string {
  return `"${text.length > 60 ? `${text.slice(0, 57)}...` : text}"`;
}

/** Reads a whole NMEA 0183 log into a track and rejections; see `readNmeaEvents`. */
export function readNmea(input: LogInput, options: ReadOptions = {}): LogReadResult {
  const decoded = decodeLogText(input.fileName, input.content);
  if (!decoded.ok) return refusedLog('nmea', decoded.rejection);
  return collectReadEvents(readNmeaEvents({ fileName: input.fileName, chunks: [decoded.text] }, options), {
    fileName: input.fileName,
    format: 'nmea',
    timeZone: 'UTC',
  });
}
