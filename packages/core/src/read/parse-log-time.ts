import { DateTime, IANAZone } from 'luxon';
import { InvalidArgumentError } from '../errors.js';

/** A parsed time, or why not. */
export type ParsedTime =
  | { ok: true; timeMs: number; hadOffset: boolean }
  | { ok: false; code: 'unparsable-time' | 'time-out-of-range'; expected: string };

/** Earliest accepted time: 1980-01-01 UTC (GPS time starts 1980-01-06; from memory). Earlier years are log faults. */
export const EARLIEST_TIME_MS = Date.UTC(1980, 0, 1);
/** Latest accepted time (exclusive): 2100-01-01 UTC. */
export const LATEST_TIME_MS = Date.UTC(2100, 0, 1);

const RANGE_EXPECTED = 'a time from 1980-01-01 to 2099-12-31 UTC';
const ISO_EXPECTED =
  'an ISO 8601 date and time (e.g. 2026-06-01T10:15:30Z), a date and a time, or epoch seconds/milliseconds';

interface DateFields {
  year: number;
  month: number;
  day: number;
}
interface TimeFields {
  hour: number;
  minute: number;
  second: number;
  ms: number;
  /** Minutes east of UTC, when the text gave an offset. */
  offsetMin?: number;
}

const DATE_YMD = /^(\d{4})[-/.](\d{1,2})[-/.](\d{1,2})$/;
const DATE_DMY = /^(\d{1,2})[./](\d{1,2})[./](\d{4})$/;
const DATE_COMPACT = /^(\d{4})(\d{2})(\d{2})$/;
const TIME = /^(\d{1,2}):?(\d{2})(?::?(\d{2})(?:[.,](\d{1,9}))?)?\s*(Z|UTC|GMT|[+-]\d{2}(?::?\d{2})?)?$/i;

/** Reads a date written `YYYY-MM-DD`, `YYYY/MM/DD`, `YYYYMMDD`, or day-first `DD.MM.YYYY` / `DD/MM/YYYY`. */
export function parseDateFields(text: string): DateFields | undefined {
  const s = text.trim();
  let m = DATE_YMD.exec(s) ?? DATE_COMPACT.exec(s);
  if (m !== null) return checkDate(Number(m[1]), Number(m[2]), Number(m[3]));
  m = DATE_DMY.exec(s);
  if (m !== null) return checkDate(Number(m[3]), Number(m[2]), Number(m[1]));
  return undefined;
}

/** Reads a time of day `HH:MM[:SS[.fff]]` or `HHMMSS[.fff]`, with an optional `Z` or `±HH[:MM]` offset. */
export function parseTimeFields(text: string): TimeFields | undefined {
  const m = TIME.exec(text.trim());
  if (m === null) return undefined;
  const hour = Number(m[1]);
  const minute = Number(m[2]);
  const second = m[3] === undefined ? 0 : Number(m[3]);
  const ms = m[4] === undefined ? 0 : Number(`0.${m[4]}`) * 1000;
  // 24:00:00 is not accepted; a leap second 60 is (it folds into the next second).
  if (hour > 23 || minute > 59 || second > 60) return undefined;
  const fields: TimeFields = { hour, minute, second, ms };
  const zone = m[5];
  if (zone !== undefined) {
    const upper = zone.toUpperCase();
    if (upper === 'Z' || upper === 'UTC' || upper === 'GMT') fields.offsetMin = 0;
    else {
      const digits = zone.replace(':', '');
      const sign = digits.startsWith('-') ? -1 : 1;
      const hh = Number(digits.slice(1, 3));
      const mm = digits.length > 3 ? Number(digits.slice(3, 5)) : 0;
      if (hh > 18 || mm > 59) return undefined;
      fields.offsetMin = sign * (hh * 60 + mm);
    }
  }
  return fields;
}

function checkDate(year: number, month: number, day: number): DateFields | undefined {
  if (month < 1 || month > 12 || day < 1 || day > 31) return undefined;
  const probe = new Date(Date.UTC(year, month - 1, day));
  if (probe.getUTCDate() !== day) return undefined; // 31 April, 29 February in a common year
  return { year, month, day };
}

/** Zones already found valid (checking one builds a formatter: milliseconds, once per reader otherwise). */
const KNOWN_ZONES = new Set<string>();

/**
 * Turns wall-clock times into UTC: directly when the text has an offset, through the IANA zone
 * (luxon's tz database, not hand-written rules) when it has none. Remembers the last time so an
 * ambiguous local time in the hour clocks go back is read as the one that keeps time moving forward.
 */
export class LogTimeParser {
  readonly zone: string;
  #lastMs = Number.NEGATIVE_INFINITY;
  #offsetCache = new Map<number, number>();
  /** The 30-minute slot of the last wall time `wallToUtcMs` read uniquely, and its offset. */
  #wallSlot = Number.NaN;
  #wallSlotOffset = 0;
  /** Set once an ambiguous local time (clocks going back) has been resolved. */
  sawAmbiguousLocalTime = false;
  /** Set once a time without offset was read as UTC because no zone was given. */
  sawZonelessTimeAsUtc = false;

  /** `zone` is an IANA name or `UTC`; an unknown zone is a caller mistake (`InvalidArgumentError`). */
  constructor(zone = 'UTC') {
    if (zone !== 'UTC' && !KNOWN_ZONES.has(zone)) {
      if (!IANAZone.isValidZone(zone))
        throw new InvalidArgumentError(`unknown IANA time zone "${zone}" (expected a name like Europe/Oslo or UTC)`);
      KNOWN_ZONES.add(zone);
    }
    this.zone = zone;
  }

  /** Parses one date-time cell: ISO 8601 (`T` or space), with or without an offset. */
  parseDateTime(text: string): ParsedTime {
    const fast = parseIsoUtcFast(text);
    if (fast !== undefined) return this.#accept(fast, true);
    const s = text.trim();
    const split = s.search(/[T\s]/);
    if (split < 0) return { ok: false, code: 'unparsable-time', expected: ISO_EXPECTED };
    return this.parseDateAndTime(s.slice(0, split), s.slice(split + 1));
  }

  /** Parses a date cell and a time-of-day cell. */
  parseDateAndTime(dateText: string, timeText: string): ParsedTime {
    const date = parseDateFields(dateText);
    const time = parseTimeFields(timeText);
    if (date === undefined || time === undefined) return { ok: false, code: 'unparsable-time', expected: ISO_EXPECTED };
    return this.fromFields(date, time);
  }

  /** Combines parsed date and time fields into UTC ms. */
  fromFields(date: DateFields, time: TimeFields): ParsedTime {
    const wall = Date.UTC(date.year, date.month - 1, date.day, time.hour, time.minute, time.second) + time.ms;
    if (time.offsetMin !== undefined) return this.#accept(wall - time.offsetMin * 60_000, true);
    if (this.zone === 'UTC') {
      this.sawZonelessTimeAsUtc = true;
      return this.#accept(wall, false);
    }
    const candidates: number[] = [];
    for (const probe of [wall - 43_200_000, wall + 43_200_000]) {
      const offsetMin = this.#offsetMinAt(probe);
      const utc = wall - offsetMin * 60_000;
      if (this.#offsetMinAt(utc) === offsetMin && !candidates.includes(utc)) candidates.push(utc);
    }
    candidates.sort((a, b) => a - b);
    const [first, second] = candidates;
    if (first === undefined) {
      return {
        ok: false,
        code: 'unparsable-time',
        expected: `a local time that exists in ${this.zone} (this one falls in the hour the clocks skip)`,
      };
    }
    if (second === undefined) return this.#accept(first, false);
    this.sawAmbiguousLocalTime = true;
    return this.#accept(first >= this.#lastMs ? first : second, false);
  }

  /** Reads epoch seconds or milliseconds. */
  parseEpoch(text: string, unit: 's' | 'ms'): ParsedTime {
    const value = Number(text.trim().replace(',', '.'));
    if (text.trim() === '' || !Number.isFinite(value)) {
      return { ok: false, code: 'unparsable-time', expected: `epoch ${unit === 's' ? 'seconds' : 'milliseconds'}` };
    }
    return this.#accept(unit === 's' ? value * 1000 : value, true);
  }

  /** Range-checks and accepts an already computed UTC time. */
  acceptUtc(timeMs: number): ParsedTime {
    return this.#accept(timeMs, true);
  }

  /**
   * For the CSV fast path: range-checks an already computed UTC time and remembers it as the last
   * time (as `parseDateTime` would), without allocating a result; `NaN` when out of range.
   */
  acceptUtcMs(timeMs: number): number {
    if (!(timeMs >= EARLIEST_TIME_MS && timeMs < LATEST_TIME_MS)) return Number.NaN;
    this.#lastMs = timeMs;
    return timeMs;
  }

  /**
   * For the CSV fast path: a wall-clock time without offset (ms as if it were UTC) in UTC ms, the
   * same as `fromFields` gives, when that reading is unique and in range; `NaN` otherwise (the hour
   * the clocks skip or repeat, out of range), leaving the row to the general path.
   */
  wallToUtcMs(wallMs: number): number {
    if (this.zone === 'UTC') {
      this.sawZonelessTimeAsUtc = true;
      return this.acceptUtcMs(wallMs);
    }
    // Every probe of `fromFields` lies in a slot fixed by the wall time's 30-minute slot when the
    // offset is a whole number of half hours, so the answer holds for the whole slot.
    const slot = Math.floor(wallMs / 1_800_000);
    if (slot === this.#wallSlot) return this.acceptUtcMs(wallMs - this.#wallSlotOffset * 60_000);
    const before = this.#offsetMinAt(wallMs - 43_200_000);
    const after = this.#offsetMinAt(wallMs + 43_200_000);
    if (before !== after) {
      // near a change of offset: the candidates of `fromFields`, taken only when there is one
      const first = wallMs - before * 60_000;
      const second = wallMs - after * 60_000;
      const firstFits = this.#offsetMinAt(first) === before;
      const secondFits = this.#offsetMinAt(second) === after;
      if (firstFits === secondFits) return Number.NaN; // the hour skipped, or the hour repeated
      return this.acceptUtcMs(firstFits ? first : second);
    }
    // both probes give the same offset, so the two candidates of `fromFields` are one
    const utc = wallMs - before * 60_000;
    if (this.#offsetMinAt(utc) !== before) return Number.NaN;
    if (before % 30 === 0) {
      this.#wallSlot = slot;
      this.#wallSlotOffset = before;
    }
    return this.acceptUtcMs(utc);
  }

  #accept(timeMs: number, hadOffset: boolean): ParsedTime {
    if (!(timeMs >= EARLIEST_TIME_MS && timeMs < LATEST_TIME_MS))
      return { ok: false, code: 'time-out-of-range', expected: RANGE_EXPECTED };
    this.#lastMs = timeMs;
    return { ok: true, timeMs, hadOffset };
  }

  #offsetMinAt(utcMs: number): number {
    // Zone offsets change on whole hours (or half hours) in the tz database; caching per 30 minutes is exact.
    const key = Math.floor(utcMs / 1_800_000);
    let offset = this.#offsetCache.get(key);
    if (offset === undefined) {
      offset = DateTime.fromMillis(key * 1_800_000, { zone: this.zone }).offset;
      this.#offsetCache.set(key, offset);
    }
    return offset;
  }
}

/** `YYYY-MM-DDTHH:MM:SS[.fff]Z` read by hand (the common form on the hot path); `undefined` for anything else. */
function parseIsoUtcFast(s: string): number | undefined {
  const n = s.length;
  if (n < 20 || s.charCodeAt(n - 1) !== 90 /* Z */ || s.charCodeAt(4) !== 45 || s.charCodeAt(7) !== 45)
    return undefined;
  const sep = s.charCodeAt(10);
  if ((sep !== 84 && sep !== 32) || s.charCodeAt(13) !== 58 || s.charCodeAt(16) !== 58) return undefined;
  const year = digits(s, 0, 4);
  const month = digits(s, 5, 2);
  const day = digits(s, 8, 2);
  const hour = digits(s, 11, 2);
  const minute = digits(s, 14, 2);
  const second = digits(s, 17, 2);
  if (
    year < 0 ||
    month < 1 ||
    month > 12 ||
    day < 1 ||
    day > 31 ||
    hour < 0 ||
    hour > 23 ||
    minute < 0 ||
    minute > 59 ||
    second < 0 ||
    second > 60
  )
    return undefined;
  let ms = 0;
  if (n > 20) {
    if (s.charCodeAt(19) !== 46 || n === 21) return undefined;
    let scale = 100;
    for (let i = 20; i < n - 1; i++) {
      const d = s.charCodeAt(i) - 48;
      if (d < 0 || d > 9) return undefined;
      ms += d * scale;
      scale /= 10;
    }
  }
  const key = year * 10_000 + month * 100 + day;
  if (key !== isoDay.key) {
    if (day > 28 && new Date(Date.UTC(year, month - 1, day)).getUTCDate() !== day) return undefined;
    isoDay.key = key;
    isoDay.startMs = Date.UTC(year, month - 1, day);
  }
  // The same integer Date.UTC(year, month - 1, day, hour, minute, second) gives (exact below 2^53).
  return isoDay.startMs + hour * 3_600_000 + minute * 60_000 + second * 1000 + ms;
}

/** The UTC day `parseIsoUtcFast` read last: a log's times mostly share their date, so Date.UTC runs once a day. */
const isoDay = { key: -1, startMs: 0 };

function digits(s: string, start: number, count: number): number {
  let value = 0;
  for (let i = start; i < start + count; i++) {
    const d = s.charCodeAt(i) - 48;
    if (d < 0 || d > 9) return -1;
    value = value * 10 + d;
  }
  return value;
}
