import { describe, expect, it } from 'vitest';
import { escapeXml, formatDecimal, formatIsoTime } from './format-decimal.js';

describe('formatDecimal', () => {
  it('never uses exponent notation (xsd:decimal has none)', () => {
    expect(formatDecimal(1e-7)).toBe('0.0000001');
    expect(formatDecimal(-2.5e-9)).toBe('-0.0000000025');
    expect(formatDecimal(1.5e21)).toBe('1500000000000000000000');
  });

  it('rounds to fixed decimals and trims trailing zeros; -0 becomes 0; non-finite becomes empty', () => {
    expect(formatDecimal(12.3456789, 3)).toBe('12.346');
    expect(formatDecimal(12.5, 3)).toBe('12.5');
    expect(formatDecimal(-0.0000001, 3)).toBe('0');
    expect(formatDecimal(Number.NaN)).toBe('');
    expect(formatDecimal(Number.POSITIVE_INFINITY, 2)).toBe('');
  });

  it('writes the shortest digits that read back to the same double', () => {
    for (const v of [59.0412, 0.1 + 0.2, -179.9999999999, 123456.789]) expect(Number(formatDecimal(v))).toBe(v);
  });
});

describe('escapeXml', () => {
  it('escapes the five XML special characters', () => {
    expect(escapeXml(`<a href="x">&'</a>`)).toBe('&lt;a href=&quot;x&quot;&gt;&amp;&apos;&lt;/a&gt;');
  });
});

describe('formatIsoTime', () => {
  it('writes ISO 8601 UTC with milliseconds, empty for NaN or out-of-range', () => {
    expect(formatIsoTime(Date.UTC(2026, 4, 14, 8, 10, 0, 250))).toBe('2026-05-14T08:10:00.250Z');
    expect(formatIsoTime(Number.NaN)).toBe('');
    expect(formatIsoTime(1e20)).toBe('');
  });

  it('agrees with Date#toISOString (the ECMAScript ISO 8601 form) along a track, across midnight, before 1970 and at the year ends', () => {
    const times: number[] = [];
    for (let i = 0; i < 200_000; i++) times.push(Date.UTC(2026, 5, 30, 23, 0, 0) + i * 997);
    for (let i = 0; i < 2_000; i++) times.push(Date.UTC(1969, 11, 31, 23, 59, 0) + i * 61);
    times.push(-1, 0, 86_399_999, 86_400_000, -86_400_000, 1.5, 1000.25);
    times.push(Date.UTC(0, 0, 1) - 1, Date.UTC(9999, 11, 31, 23, 59, 59, 999), Date.UTC(9999, 11, 31) + 86_400_000);
    times.push(Date.UTC(2026, 5, 1), Date.UTC(2025, 0, 1), Date.UTC(2026, 5, 1) + 5);
    const wrong = times.filter((t) => formatIsoTime(t) !== new Date(t).toISOString());
    expect(wrong).toEqual([]);
  });
});
