import { describe, expect, it } from 'vitest';
import { formatDecimal, formatIsoTime } from './format-decimal.js';
import { TextBuffer } from './text-buffer.js';

// A fixed pseudo-random sequence (xorshift32), so a failure names the same values every run.
function sequence(seed: number): () => number {
  let x = seed;
  return () => {
    x ^= x << 13;
    x ^= x >>> 17;
    x ^= x << 5;
    return (x >>> 0) / 2 ** 32;
  };
}

// (A generous timeout: these compare tens of thousands of values on a busy shared machine.)
// Values that exercise the fast paths and their limits: logged decimals, long binary fractions,
// exact halves (ties), exponent-form magnitudes, signs and zeros.
function sampleValues(): number[] {
  const next = sequence(20260514);
  const values = [
    0,
    -0,
    1,
    -1,
    0.5,
    1.5,
    2.5,
    -2.5,
    0.125,
    1.005,
    1.0005,
    0.1 + 0.2,
    127,
    127.0,
    56.44211066666667,
    -5.619554500000001,
    1e-7,
    -2.5e-9,
    1e-6,
    9.99999e-7,
    1.5e21,
    123456789012345.6,
    999999999999999,
    1e15,
    2 ** 53,
    6258366.9005,
    338523.6285,
    0.0000001,
    -0.0000001,
    179.99999999999997,
    -180,
    1e300,
    Number.MIN_VALUE,
    Number.MAX_VALUE,
    Number.NaN,
    Number.POSITIVE_INFINITY,
    Number.NEGATIVE_INFINITY,
  ];
  for (let i = 0; i < 6_000; i++) {
    values.push((next() - 0.5) * 360);
    values.push(Math.round(next() * 100_000) / 100);
    values.push(Math.round((next() - 0.5) * 2e10) / 1e8);
    values.push(next() * 10 ** Math.floor(next() * 30 - 12));
    values.push(Math.round(next() * 8000) / 8);
    values.push(Math.round((next() - 0.5) * 3.6e9) / 1e7);
  }
  return values;
}

// Each value written on its own line, paired with what the string function gives; the pairs that differ.
function mismatches(values: number[], write: (out: TextBuffer, v: number) => void, expected: (v: number) => string) {
  const out = new TextBuffer();
  for (const v of values) {
    write(out, v);
    out.char(10);
  }
  const lines = out.toString().split('\n');
  return values.flatMap((v, i) =>
    lines[i] === expected(v) ? [] : [{ value: v, wrote: lines[i], expected: expected(v) }],
  );
}

describe('TextBuffer', () => {
  const values = sampleValues();

  it('writes fixed decimals exactly as formatDecimal(value, decimals) (toFixed, trailing zeros dropped)', () => {
    for (const decimals of [0, 2, 3, 7, 8])
      expect(
        mismatches(
          values,
          (o, v) => o.fixed(v, decimals),
          (v) => formatDecimal(v, decimals),
        ),
      ).toEqual([]);
  }, 30_000);

  it('writes the shortest digits exactly as formatDecimal(value) and String(value)', () => {
    for (const likelyDecimals of [0, 3, 7]) {
      expect(mismatches(values, (o, v) => o.shortest(v, likelyDecimals), formatDecimal)).toEqual([]);
      expect(mismatches(values, (o, v) => o.number(v, likelyDecimals), String)).toEqual([]);
    }
  }, 30_000);

  it('writes ISO times exactly as formatIsoTime along a track, across days, before 1970 and out of range', () => {
    const times: number[] = [];
    for (let i = 0; i < 100_000; i++) times.push(Date.UTC(2026, 5, 30, 23, 0, 0) + i * 997);
    for (let i = 0; i < 2_000; i++) times.push(Date.UTC(1969, 11, 31, 23, 59, 0) + i * 61);
    times.push(-1, 0, 86_399_999, 86_400_000, 1.5, 1000.25, Number.NaN, 1e20, Date.UTC(9999, 11, 31, 23, 59, 59, 999));
    const out = new TextBuffer();
    for (const t of times) {
      out.isoTime(t);
      out.char(10);
    }
    expect(out.toString()).toBe(times.map((t) => `${formatIsoTime(t)}\n`).join(''));
  });

  it('keeps text of any script as UTF-8 and truncates to a byte length', () => {
    const out = new TextBuffer();
    out.text('Hollowtide – Skarvholmen ø');
    const at = out.byteLength;
    out.ascii(',12');
    out.truncate(at);
    out.bytes(TextBuffer.encode(' ✓'));
    expect(out.toString()).toBe('Hollowtide – Skarvholmen ø ✓');
  });
});
