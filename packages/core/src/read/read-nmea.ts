import type { RejectionCode } from '../model/rejection.js';
import type { Fix, TrackRole } from '../model/track.js';
import { MPS_PER_KNOT, normaliseAzimuthDeg } from '../model/units.js';
import { collectReadEvents } from './collect-read-events.js';
import { decodeLogText } from './decode-log-text.js';
import type { LogInput, LogReadResult, ReadOptions } from './log-read-result.js';
import { parseDecimal } from './parse-csv-row-fast.js';
import { EARLIEST_TIME_MS, LATEST_TIME_MS, LogTimeParser } from './parse-log-time.js';
import { type LogTextInput, refusedLog } from './read-csv.js';
import type { ReadEvent } from './read-event.js';
import { iterateLogLines } from './split-log-lines.js';

const DAY_MS = 86_400_000;
const HALF_DAY_MS = 43_200_000;
/** Epochs held while waiting for the first date (RMC or ZDA); beyond this they are rejected `no-date`. */
const MAX_UNDATED_EPOCHS = 100_000;
/** NMEA 0183 limit: 82 characters including `$` and CR LF (NMEA Revealed, E. S. Raymond). */
const NMEA_MAX_SENTENCE = 82;

interface Epoch {
  todMs: number;
  line: number;
  fix: Fix;
  /** UTC ms of 00:00 of the epoch's date, when an RMC in the epoch gave it. */
  dayMs?: number;
  hasPosition: boolean;
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
 * `unparsable-time`, `no-date`, `time-out-of-range`, `line-too-long`. Other sentence types are
 * counted as non-fix rows.
 */
export function* readNmeaEvents(input: LogTextInput, options: ReadOptions = {}): Generator<ReadEvent> {
  const file = input.fileName;
  const times = new LogTimeParser('UTC');
  const role: TrackRole = options.role ?? (/surface|ship|vessel|boat/i.test(file) ? 'surface' : 'vehicle');
  yield { kind: 'track', role };
  let rowCount = 0;
  let dayMs: number | undefined; // 00:00 UTC of the current date
  let lastTodMs: number | undefined;
  let current: Epoch | undefined;
  let extras: Partial<Fix> = {};
  let extrasPending = false;
  const undated: Epoch[] = [];
  const unused = new Map<string, number>();
  let withoutChecksum = 0;
  let overLength = 0;
  let altitudes = 0;
  let positiveAltitudes = 0;
  let magneticWithoutVariation = 0;
  const reject = (line: number, code: RejectionCode, expected: string, found: string, column?: number): ReadEvent => ({
    kind: 'rejection',
    rejection:
      column === undefined ? { file, line, code, expected, found } : { file, line, column, code, expected, found },
  });
  /** Events made by the helpers below, handed on after each sentence (plain functions: no generator per sentence). */
  const out: ReadEvent[] = [];
  /** Dates an epoch from the carried date, rolling over at midnight. */
  const dateEpoch = (epoch: Epoch): void => {
    if (epoch.dayMs !== undefined) {
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
      epoch.fix.timeMs = timeMs;
      out.push({ kind: 'fix', fix: epoch.fix, line: epoch.line });
      return;
    }
    const t = times.acceptUtc(timeMs);
    if (!t.ok) {
      out.push(reject(epoch.line, t.code, t.expected, new Date(day + epoch.todMs).toISOString()));
      return;
    }
    epoch.fix.timeMs = t.timeMs;
    out.push({ kind: 'fix', fix: epoch.fix, line: epoch.line });
  };
  const flush = (): void => {
    const epoch = current;
    current = undefined;
    if (epoch === undefined) return;
    if (dayMs === undefined && epoch.dayMs === undefined) {
      if (undated.length >= MAX_UNDATED_EPOCHS) {
        out.push(reject(epoch.line, 'no-date', 'a date from an RMC or ZDA sentence before this fix', 'no date yet'));
        return;
      }
      undated.push(epoch);
      return;
    }
    if (undated.length > 0) {
      const firstDay = epoch.dayMs ?? (dayMs as number);
      const anchorTod = epoch.todMs;
      for (const u of undated) emitEpoch(u, u.todMs > anchorTod + HALF_DAY_MS ? firstDay - DAY_MS : firstDay);
      undated.length = 0;
    }
    dateEpoch(epoch);
  };
  /** Starts or joins the epoch at `todMs`; returns whether the sentence was merged into an open one. */
  const joinEpoch = (todMs: number, line: number): Epoch => {
    if (current !== undefined && current.todMs === todMs) {
      out.push({ kind: 'non-fix-row', line, why: 'merged into the fix of the same time' });
      return current;
    }
    flush();
    const fix: Fix = { timeMs: Number.NaN, latDeg: Number.NaN, lonDeg: Number.NaN };
    if (extrasPending) {
      Object.assign(fix, extras);
      extras = {};
      extrasPending = false;
    }
    current = { todMs, line, fix, hasPosition: false };
    return current;
  };
  const fields = new NmeaFields();
  for (const c of iterateLogLines(input.chunks)) {
    if (out.length > 0) {
      for (let k = 0; k < out.length; k++) yield out[k] as ReadEvent;
      out.length = 0;
    }
    const line = c.line;
    if (c.tooLongChars >= 0) {
      rowCount++;
      yield reject(line, 'line-too-long', 'an NMEA sentence of at most 82 characters', `${c.tooLongChars} characters`);
      continue;
    }
    const src = c.source;
    let from = c.start;
    let to = c.end;
    // trim white space at both ends without copying
    while (from < to && src.charCodeAt(from) <= 32) from++;
    while (to > from && src.charCodeAt(to - 1) <= 32) to--;
    if (from === to) continue;
    rowCount++;
    let at = src.charCodeAt(from) === 36 ? from : src.indexOf('$', from);
    if (at < 0 || at >= to) at = src.indexOf('!', from);
    if (at < 0 || at >= to) {
      yield reject(
        line,
        'unsupported-sentence',
        'an NMEA 0183 sentence ($, talker ID, sentence type, fields)',
        quote(src.slice(from, to)),
      );
      continue;
    }
    if (to - at + 2 > NMEA_MAX_SENTENCE) overLength++;
    const star = src.lastIndexOf('*', to - 1);
    let bodyEnd = to;
    if (star > at) {
      bodyEnd = star;
      const x = xorOfRange(src, at + 1, star);
      if (hexByteAt(src, star + 1, to) !== x) {
        yield reject(
          line,
          'bad-checksum',
          `checksum ${HEX[(x >> 4) & 15]}${HEX[x & 15]} (XOR of the characters between $ and *)`,
          `*${src.slice(star + 1, to)}`,
          star - c.start + 1,
        );
        continue;
      }
    } else {
      withoutChecksum++;
    }
    // fields are found in place and copied only when read (no split of every sentence)
    fields.reset(src, at + 1, bodyEnd);
    const address = fields.get(0);
    if (src.charCodeAt(at) === 33 || address.length < 5 || address.charCodeAt(0) === 80 /* P: proprietary */) {
      unused.set(address, (unused.get(address) ?? 0) + 1);
      yield { kind: 'non-fix-row', line, why: 'sentence type not used' };
      continue;
    }
    const typeRaw = address.slice(address.length - 3);
    const type = typeRaw === typeRaw.toUpperCase() ? typeRaw : typeRaw.toUpperCase();
    switch (type) {
      case 'GGA': {
        const tod = parseTimeOfDay(fields.get(1));
        if (tod === undefined) {
          yield reject(line, 'unparsable-time', 'a UTC time of day hhmmss.ss in GGA field 1', quote(fields.get(1)), 2);
          continue;
        }
        const quality = fields.number(6);
        if (quality === 0 || fields.isEmpty(2) || fields.isEmpty(4)) {
          yield reject(
            line,
            'no-fix',
            'a GGA position with fix quality 1-8',
            quality === 0 ? 'quality 0 (no fix)' : 'an empty position',
          );
          continue;
        }
        const lat = parseNmeaCoordinate(fields.get(2), fields.get(3), 'lat');
        const lon = parseNmeaCoordinate(fields.get(4), fields.get(5), 'lon');
        if (lat === undefined || lon === undefined) {
          yield reject(
            line,
            'unparsable-coordinate',
            lat === undefined ? 'latitude ddmm.mmmm with N or S' : 'longitude dddmm.mmmm with E or W',
            quote(lat === undefined ? `${fields.get(2)},${fields.get(3)}` : `${fields.get(4)},${fields.get(5)}`),
          );
          continue;
        }
        const epoch = joinEpoch(tod, line);
        if (!epoch.hasPosition) {
          epoch.fix.latDeg = lat;
          epoch.fix.lonDeg = lon;
          epoch.hasPosition = true;
        }
        if (!Number.isNaN(quality)) epoch.fix.quality = quality;
        const altitude = fields.number(9);
        if (Number.isFinite(altitude)) {
          epoch.fix.depthM = -altitude + 0;
          altitudes++;
          if (altitude > 0) positiveAltitudes++;
        }
        break;
      }
      case 'RMC': {
        const tod = parseTimeOfDay(fields.get(1));
        if (tod === undefined) {
          yield reject(line, 'unparsable-time', 'a UTC time of day hhmmss.ss in RMC field 1', quote(fields.get(1)), 2);
          continue;
        }
        const day = parseNmeaDate(fields.get(9));
        if (fields.get(2) !== 'A' || fields.get(3) === '' || fields.get(5) === '') {
          if (day !== undefined && current === undefined) {
            dayMs = day;
            lastTodMs = tod;
          }
          yield reject(
            line,
            'no-fix',
            'an RMC with status A and a position',
            fields.get(2) === 'V' ? 'status V (warning, no valid fix)' : 'an empty position',
          );
          continue;
        }
        const lat = parseNmeaCoordinate(fields.get(3), fields.get(4), 'lat');
        const lon = parseNmeaCoordinate(fields.get(5), fields.get(6), 'lon');
        if (lat === undefined || lon === undefined) {
          yield reject(
            line,
            'unparsable-coordinate',
            lat === undefined ? 'latitude ddmm.mmmm with N or S' : 'longitude dddmm.mmmm with E or W',
            quote(lat === undefined ? `${fields.get(3)},${fields.get(4)}` : `${fields.get(5)},${fields.get(6)}`),
          );
          continue;
        }
        if (fields.get(9) !== '' && day === undefined) {
          yield reject(line, 'unparsable-time', 'an RMC date ddmmyy in field 9', quote(fields.get(9)), 10);
          continue;
        }
        const epoch = joinEpoch(tod, line);
        if (!epoch.hasPosition) {
          epoch.fix.latDeg = lat;
          epoch.fix.lonDeg = lon;
          epoch.hasPosition = true;
        }
        if (day !== undefined) epoch.dayMs = day;
        const sog = Number(fields.get(7));
        if (fields.get(7) !== '' && Number.isFinite(sog) && Number.isNaN(epoch.fix.speedMps ?? Number.NaN))
          epoch.fix.speedMps = sog * MPS_PER_KNOT;
        break;
      }
      case 'VTG': {
        // Older form `$--VTG,x.x,x,x.x,x.x`: field 2 is not the literal T (NMEA Revealed, VTG).
        const newer = fields.get(2) === 'T' || fields.get(2) === '';
        const knots = Number(newer ? fields.get(5) : fields.get(3));
        const kmh = Number(newer ? fields.get(7) : fields.get(4));
        const speed =
          (newer ? fields.get(5) : fields.get(3)) !== '' && Number.isFinite(knots)
            ? knots * MPS_PER_KNOT
            : (newer ? fields.get(7) : fields.get(4)) !== '' && Number.isFinite(kmh)
              ? kmh / 3.6
              : Number.NaN;
        attach({ speedMps: speed });
        yield { kind: 'non-fix-row', line, why: 'VTG merged into the current fix' };
        break;
      }
      case 'HDT': {
        const heading = Number(fields.get(1));
        if (fields.get(1) !== '' && Number.isFinite(heading)) attach({ headingDeg: normaliseAzimuthDeg(heading) });
        yield { kind: 'non-fix-row', line, why: 'HDT merged into the current fix' };
        break;
      }
      case 'HDG': {
        const magnetic = Number(fields.get(1));
        const deviation = fields.get(2) === '' ? 0 : Number(fields.get(2)) * (fields.get(3) === 'W' ? -1 : 1);
        if (fields.get(1) !== '' && Number.isFinite(magnetic)) {
          if (fields.get(4) === '') magneticWithoutVariation++;
          else {
            // true = magnetic + deviation + variation, east positive (NMEA HDG; from memory)
            const variation = Number(fields.get(4)) * (fields.get(5) === 'W' ? -1 : 1);
            const heading = magnetic + deviation + variation;
            if (Number.isFinite(heading)) attach({ headingDeg: normaliseAzimuthDeg(heading) });
          }
        }
        yield { kind: 'non-fix-row', line, why: 'HDG merged into the current fix' };
        break;
      }
      case 'ZDA': {
        const tod = parseTimeOfDay(fields.get(1));
        const d = Number(fields.get(2));
        const m = Number(fields.get(3));
        const y = Number(fields.get(4));
        const valid = tod !== undefined && /^\d{4}$/.test(fields.get(4)) && d >= 1 && d <= 31 && m >= 1 && m <= 12;
        if (!valid) {
          yield reject(
            line,
            'unparsable-time',
            'a ZDA with hhmmss.ss, day, month and 4-digit year',
            quote(src.slice(at, to)),
          );
          continue;
        }
        flush();
        const day = Date.UTC(y, m - 1, d);
        if (undated.length > 0) {
          for (const u of undated) emitEpoch(u, u.todMs > tod + HALF_DAY_MS ? day - DAY_MS : day);
          undated.length = 0;
        }
        dayMs = day;
        lastTodMs = tod;
        yield { kind: 'non-fix-row', line, why: 'ZDA sets the date' };
        break;
      }
      default:
        unused.set(type, (unused.get(type) ?? 0) + 1);
        yield { kind: 'non-fix-row', line, why: 'sentence type not used' };
    }
  }
  flush();
  yield* out;
  out.length = 0;
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

  function attach(values: Partial<Fix>): void {
    if (current === undefined) extrasPending = true;
    const target = current === undefined ? extras : current.fix;
    for (const [k, v] of Object.entries(values))
      if (typeof v === 'number' && !Number.isNaN(v)) (target as Record<string, number>)[k] = v;
  }
}

const HEX = '0123456789ABCDEF';

function xorOfRange(text: string, start: number, end: number): number {
  let x = 0;
  for (let i = start; i < end; i++) x ^= text.charCodeAt(i);
  return x;
}

function hexDigit(code: number): number {
  if (code >= 48 && code <= 57) return code - 48;
  if (code >= 65 && code <= 70) return code - 55;
  if (code >= 97 && code <= 102) return code - 87;
  return -1;
}

/** The two hex digits at `at` as a byte, or -1 when they are not two hex digits before `end`. */
function hexByteAt(text: string, at: number, end: number): number {
  if (at + 2 > end) return -1;
  const high = hexDigit(text.charCodeAt(at));
  const low = hexDigit(text.charCodeAt(at + 1));
  return high < 0 || low < 0 ? -1 : high * 16 + low;
}

/** The comma-separated fields of one sentence body, located in place; `get` copies one field. */
class NmeaFields {
  #src = '';
  #end = 0;
  #count = 0;
  readonly #starts = new Int32Array(64);

  reset(src: string, start: number, end: number): void {
    this.#src = src;
    this.#end = end;
    const starts = this.#starts;
    let n = 0;
    starts[n++] = start;
    let at = start;
    while (n < starts.length) {
      const comma = src.indexOf(',', at);
      if (comma < 0 || comma >= end) break;
      at = comma + 1;
      starts[n++] = at;
    }
    this.#count = n;
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
    const fast = parseDecimal(this.#src, start, end);
    if (!Number.isNaN(fast)) return fast;
    const value = Number(this.#src.slice(start, end));
    return Number.isFinite(value) ? value : Number.NaN;
  }

  /** Field `i` (0 is the address), `''` beyond the last one (truncated trailing fields). */
  get(i: number): string {
    if (i >= this.#count) return '';
    const start = this.#starts[i] as number;
    const end = i + 1 < this.#count ? (this.#starts[i + 1] as number) - 1 : this.#end;
    return this.#src.slice(start, end);
  }
}

/** `hhmmss[.ss]` to milliseconds after midnight; `undefined` when malformed. */
export function parseTimeOfDay(text: string): number | undefined {
  const n = text.length;
  if (n < 6 || (n > 6 && (n === 7 || text.charCodeAt(6) !== 46))) return undefined;
  const h = twoDigits(text, 0);
  const m = twoDigits(text, 2);
  const whole = twoDigits(text, 4);
  if (h < 0 || m < 0 || whole < 0 || h > 23 || m > 59 || whole > 60) return undefined;
  let fractionMs = 0;
  let scale = 100;
  for (let i = 7; i < n; i++) {
    const d = text.charCodeAt(i) - 48;
    if (d < 0 || d > 9) return undefined;
    fractionMs += d * scale;
    scale /= 10;
  }
  return Math.round((h * 3600 + m * 60 + whole) * 1000 + fractionMs);
}

function twoDigits(text: string, at: number): number {
  const a = text.charCodeAt(at) - 48;
  const b = text.charCodeAt(at + 1) - 48;
  return a < 0 || a > 9 || b < 0 || b > 9 ? -1 : a * 10 + b;
}

/** `ddmmyy` to 00:00 UTC ms; two-digit years 80-99 are 19xx, 00-79 are 20xx (common practice for NMEA dates). */
export function parseNmeaDate(text: string): number | undefined {
  if (!/^\d{6}$/.test(text)) return undefined;
  const d = Number(text.slice(0, 2));
  const m = Number(text.slice(2, 4));
  const yy = Number(text.slice(4, 6));
  if (d < 1 || d > 31 || m < 1 || m > 12) return undefined;
  return Date.UTC(yy >= 80 ? 1900 + yy : 2000 + yy, m - 1, d);
}

/** NMEA `(d)ddmm.mmmm` plus hemisphere letter to signed degrees; `undefined` when malformed or out of range. */
export function parseNmeaCoordinate(value: string, hemisphere: string, axis: 'lat' | 'lon'): number | undefined {
  const degDigits = axis === 'lat' ? 2 : 3;
  const dot = value.indexOf('.');
  const intLength = dot < 0 ? value.length : dot;
  if (intLength !== degDigits + 2 || value.length === dot + 1) return undefined;
  const valid = axis === 'lat' ? hemisphere === 'N' || hemisphere === 'S' : hemisphere === 'E' || hemisphere === 'W';
  if (!valid) return undefined;
  let deg = 0;
  for (let i = 0; i < degDigits; i++) {
    const d = value.charCodeAt(i) - 48;
    if (d < 0 || d > 9) return undefined;
    deg = deg * 10 + d;
  }
  const min = parseDecimal(value, degDigits, value.length);
  if (Number.isNaN(min) || min >= 60 || value.charCodeAt(degDigits) === 45 || value.charCodeAt(degDigits) === 43)
    return undefined;
  const magnitude = deg + min / 60;
  if (magnitude > (axis === 'lat' ? 90 : 180)) return undefined;
  return hemisphere === 'S' || hemisphere === 'W' ? -magnitude : magnitude;
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
