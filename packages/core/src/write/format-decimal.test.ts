import { describe, expect, it } from 'vitest';
import { escapeXml, formatDecimal, formatIsoTime, roundHalfUp } from './format-decimal.js';

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

describe('roundHalfUp', () => {
  // Object.is tells -0 from 0 and matches NaN: the result must be Math.round's in every bit.
  const differing = (values: number[]) => values.filter((x) => !Object.is(roundHalfUp(x), Math.round(x)));

  it('gives Math.round at its edges: halves, the double just below a half, zeros, 2^52 and beyond, non-finite', () => {
    const edges = [
      0.5,
      -0.5,
      1.5,
      -1.5,
      2.5,
      -2.5,
      0.49999999999999994,
      -0.49999999999999994,
      0.5000000000000001,
      -0.5000000000000001,
      0,
      -0,
      1e-300,
      -1e-300,
      Number.MIN_VALUE,
      -Number.MIN_VALUE,
      2 ** 52 - 0.5,
      -(2 ** 52) + 0.5,
      2 ** 52,
      2 ** 52 + 1,
      -(2 ** 52) - 1,
      2 ** 53 + 2,
      4503599627370495.5,
      -4503599627370495.5,
      1e300,
      Number.NaN,
      Number.POSITIVE_INFINITY,
      Number.NEGATIVE_INFINITY,
    ];
    expect(differing(edges)).toEqual([]);
  });

  it('gives Math.round for coordinates scaled to 7 decimals and for random magnitudes of either sign', () => {
    let seed = 20260902;
    const next = () => {
      seed ^= seed << 13;
      seed ^= seed >>> 17;
      seed ^= seed << 5;
      return (seed >>> 0) / 2 ** 32;
    };
    const values: number[] = [];
    for (let i = 0; i < 50_000; i++) {
      values.push((next() - 0.5) * 360 * 1e7);
      values.push((next() - 0.5) * 10 ** Math.floor(next() * 40 - 20));
      // Exact halves and their neighbours either side.
      const half = Math.floor((next() - 0.5) * 1e6) + 0.5;
      values.push(half, half + 2 ** -30, half - 2 ** -30);
    }
    expect(differing(values)).toEqual([]);
  });
});
