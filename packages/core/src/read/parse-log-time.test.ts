import { describe, expect, it } from 'vitest';
import { InvalidArgumentError } from '../errors.js';
import { LogTimeParser, parseDateFields, parseTimeFields } from './parse-log-time.js';

const utc = (s: string) => Date.parse(s);

describe('LogTimeParser', () => {
  it('reads ISO 8601 with Z, with an offset, with a space, and with fractions', () => {
    const p = new LogTimeParser();
    expect(p.parseDateTime('2026-06-01T10:00:00Z')).toEqual({
      ok: true,
      timeMs: utc('2026-06-01T10:00:00Z'),
      hadOffset: true,
    });
    expect(p.parseDateTime('2026-06-01T10:00:00.25Z')).toMatchObject({ timeMs: utc('2026-06-01T10:00:00.250Z') });
    expect(p.parseDateTime('2026-06-01 12:00:00+02:00')).toMatchObject({ timeMs: utc('2026-06-01T10:00:00Z') });
    expect(p.parseDateTime('2026-06-01T05:30:00-0430')).toMatchObject({ timeMs: utc('2026-06-01T10:00:00Z') });
  });

  it('reads times without offset in the stated IANA zone through the tz database', () => {
    // Europe/Oslo is UTC+2 in summer (CEST) and UTC+1 in winter (CET); tz database, from memory.
    const oslo = new LogTimeParser('Europe/Oslo');
    expect(oslo.parseDateTime('2026-06-01 12:00:00')).toMatchObject({
      timeMs: utc('2026-06-01T10:00:00Z'),
      hadOffset: false,
    });
    expect(oslo.parseDateTime('2026-12-01 12:00:00')).toMatchObject({ timeMs: utc('2026-12-01T11:00:00Z') });
    // America/Santiago: southern-hemisphere summer time (UTC-3 in January); from memory.
    const santiago = new LogTimeParser('America/Santiago');
    expect(santiago.parseDateTime('2026-01-15 12:00:00')).toMatchObject({ timeMs: utc('2026-01-15T15:00:00Z') });
  });

  it('keeps time moving forward through the repeated hour and refuses the skipped one', () => {
    // EU rule: clocks go back at 01:00 UTC on the last Sunday of October (2026-10-25), forward on the last Sunday of March (2026-03-29).
    const oslo = new LogTimeParser('Europe/Oslo');
    expect(oslo.parseDateTime('2026-10-25 02:30:00')).toMatchObject({ timeMs: utc('2026-10-25T00:30:00Z') });
    expect(oslo.parseDateTime('2026-10-25 02:10:00')).toMatchObject({ timeMs: utc('2026-10-25T01:10:00Z') });
    expect(oslo.sawAmbiguousLocalTime).toBe(true);
    expect(oslo.parseDateTime('2026-03-29 02:30:00')).toMatchObject({ ok: false, code: 'unparsable-time' });
  });

  it('reads epoch seconds and milliseconds and refuses years outside 1980-2099', () => {
    const p = new LogTimeParser();
    expect(p.parseEpoch('1780308000', 's')).toMatchObject({ timeMs: 1780308000000 });
    expect(p.parseEpoch('1780308000500', 'ms')).toMatchObject({ timeMs: 1780308000500 });
    expect(p.parseDateTime('1900-01-01T00:00:00Z')).toMatchObject({ ok: false, code: 'time-out-of-range' });
    expect(p.parseDateTime('2200-01-01T00:00:00Z')).toMatchObject({ ok: false, code: 'time-out-of-range' });
    expect(p.parseDateTime('2026-02-29T00:00:00Z')).toMatchObject({ ok: false, code: 'unparsable-time' });
    expect(p.parseEpoch('NaN', 's')).toMatchObject({ ok: false, code: 'unparsable-time' });
  });

  it('throws for an unknown zone (a caller mistake)', () => {
    expect(() => new LogTimeParser('Mars/Olympus_Mons')).toThrow(InvalidArgumentError);
  });
});

describe('parseDateFields', () => {
  it('reads year-first, compact and day-first dates', () => {
    expect(parseDateFields('2026-06-01')).toEqual({ year: 2026, month: 6, day: 1 });
    expect(parseDateFields('20260601')).toEqual({ year: 2026, month: 6, day: 1 });
    expect(parseDateFields('01.06.2026')).toEqual({ year: 2026, month: 6, day: 1 });
    expect(parseDateFields('31.04.2026')).toBeUndefined();
  });
});

describe('parseTimeFields', () => {
  it('reads clock times with and without separators and offsets', () => {
    expect(parseTimeFields('10:00:01.5')).toEqual({ hour: 10, minute: 0, second: 1, ms: 500 });
    expect(parseTimeFields('100001')).toEqual({ hour: 10, minute: 0, second: 1, ms: 0 });
    expect(parseTimeFields('10:00Z')).toEqual({ hour: 10, minute: 0, second: 0, ms: 0, offsetMin: 0 });
    expect(parseTimeFields('25:00:00')).toBeUndefined();
  });
});

describe('parseDateTime on runs of UTC times (the day is worked out once per date)', () => {
  it('gives Date.parse’s instant for every time of a run crossing days, months and leap days', () => {
    // Date.parse (ECMAScript's own reading of the ISO 8601 form) is the reference.
    const p = new LogTimeParser();
    let checked = 0;
    for (let t = Date.UTC(2024, 1, 27, 22); t < Date.UTC(2024, 2, 2, 2); t += 997_003) {
      const text = new Date(t).toISOString();
      expect(p.parseDateTime(text)).toMatchObject({ ok: true, timeMs: Date.parse(text) });
      checked++;
    }
    expect(checked).toBeGreaterThan(250);
    // a date that does not exist is refused even right after a valid day of the same month
    expect(p.parseDateTime('2025-02-28T23:59:59Z')).toMatchObject({
      ok: true,
      timeMs: Date.parse('2025-02-28T23:59:59Z'),
    });
    expect(p.parseDateTime('2025-02-29T00:00:00Z')).toMatchObject({ ok: false });
    expect(p.parseDateTime('2025-04-31T00:00:00Z')).toMatchObject({ ok: false });
    expect(p.parseDateTime('2025-04-30T00:00:00.5Z')).toMatchObject({
      ok: true,
      timeMs: Date.parse('2025-04-30T00:00:00.500Z'),
    });
  });
});
