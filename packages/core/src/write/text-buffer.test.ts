import { describe, expect, it } from 'vitest';
import { formatDecimal, formatIsoTime } from './format-decimal.js';
import { SHORTEST_DIGITS, TextBuffer } from './text-buffer.js';

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
  // Edges of the digit fast paths: exact and near ties at the decimals tested, magnitudes either
  // side of 10^15, 2^31 and 10^9 (where the digits are split), rounding that carries into the
  // whole part, values that round to (negative) zero, tiny values.
  values.push(
    0.125,
    -0.125,
    2.675,
    1.0000000050000002,
    0.000000005,
    -0.000000005,
    0.0000000049999999,
    -0.0000000049999999,
    0.000000015,
    999999999999999.4,
    999999999999999.5,
    -999999999999999.5,
    1e15 - 1,
    1e15 + 1,
    99999999999999.98,
    9999999.99999999,
    2147483647.5,
    2147483648.123,
    -2147483648.987654,
    999999999.9999999,
    1000000000.0000001,
    0.999999999,
    9.9999999996,
    -99.999999995,
    59.99999999999999,
    -0.000000004,
    -0.0004,
    -1e-20,
    1e-15,
    5e-324,
    -5e-324,
    2 ** -1074,
    123.456789012345,
    0.1234567890123456,
    Number.EPSILON,
  );
  for (let i = 0; i < 6_000; i++) {
    // Exact halves at 0…8 decimals (ties go to the general path) and their neighbours.
    const half = (Math.floor((next() - 0.5) * 2e6) + 0.5) / 10 ** Math.floor(next() * 9);
    values.push(half, half * (1 + Number.EPSILON), half * (1 - Number.EPSILON));
    values.push((next() - 0.5) * 2e15);
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
    // 10 and more decimals split the fraction at 10^9; 22 is the last with an exact 10^k; 23 and
    // 30 take the general path.
    for (const decimals of [0, 1, 2, 3, 7, 8, 9, 10, 12, 15, 20, 22, 23, 30])
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

  it('writes rows of separated numbers exactly as fixed and shortest would, across general-path values and buffer growth', () => {
    // Columns as a CSV row has them (degrees to 8 decimals, metres to 3, logged values shortest),
    // filled with the sample values in turn; long general-path texts (1e300 is 301 characters)
    // land mid-row and the buffer grows from 64 KiB several times along the way.
    const decimals = [8, 8, 3, 3, SHORTEST_DIGITS, SHORTEST_DIGITS, 8, SHORTEST_DIGITS];
    const rows = Math.ceil(values.length / decimals.length) * 3;
    const columns = decimals.map((_, k) =>
      Float64Array.from({ length: rows }, (_, i) => values[(i * 5 + k * 7) % values.length] as number),
    );
    for (const likelyDecimals of [0, 3]) {
      const out = new TextBuffer();
      const expected: string[] = [];
      for (let i = 0; i < rows; i++) {
        out.separatedNumbers(59, columns, decimals, i, likelyDecimals);
        out.char(10);
        let line = '';
        for (let k = 0; k < decimals.length; k++) {
          const value = (columns[k] as Float64Array)[i] as number;
          const places = decimals[k] as number;
          line += `;${places === SHORTEST_DIGITS ? formatDecimal(value) : formatDecimal(value, places)}`;
        }
        expected.push(line);
      }
      expect(out.byteLength).toBeGreaterThan(4 << 16);
      const lines = out.toString().split('\n');
      const wrong = expected.flatMap((line, i) =>
        lines[i] === line ? [] : [{ row: i, wrote: lines[i], expected: line }],
      );
      expect(wrong.slice(0, 5)).toEqual([]);
    }
  }, 30_000);

  it("makes room again after a long general-path value that ends at the buffer's end mid-row", () => {
    // 1e300's shortest form is 301 characters (general path); the fixed values after it need room
    // that the general path's own reservation does not leave. Filler lengths sweep the free space
    // at the row's start over the range where that happens with the first 64 KiB buffer.
    const columns = [
      Float64Array.of(1e300),
      Float64Array.of(56.44211067),
      Float64Array.of(-5.6195545),
      Float64Array.of(-179.12345678),
    ];
    const decimals = [SHORTEST_DIGITS, 8, 8, 8];
    const row = `;${formatDecimal(1e300)};56.44211067;-5.6195545;-179.12345678`;
    for (let free = 100; free <= 400; free++) {
      const out = new TextBuffer();
      const filler = 'x'.repeat((1 << 16) - free);
      out.ascii(filler);
      out.separatedNumbers(59, columns, decimals, 0, 3);
      expect(out.toString()).toBe(filler + row);
    }
  });

  it('keeps what was written when making room ahead, and keeps writing after it', () => {
    const out = new TextBuffer();
    out.ascii('Hollowtide,');
    out.makeRoom(0);
    out.makeRoom(-5);
    out.fixed(56.442131, 8);
    out.makeRoom(3_000_000);
    out.char(44);
    for (let i = 0; i < 100_000; i++) out.fixed(i / 8, 3);
    const expected = `Hollowtide,56.442131,${Array.from({ length: 100_000 }, (_, i) => formatDecimal(i / 8, 3)).join('')}`;
    expect(out.toString()).toBe(expected);
  });

  it('writes ISO times exactly as formatIsoTime along a track, across days, before 1970 and out of range', () => {
    const times: number[] = [];
    for (let i = 0; i < 100_000; i++) times.push(Date.UTC(2026, 5, 30, 23, 0, 0) + i * 997);
    for (let i = 0; i < 2_000; i++) times.push(Date.UTC(1969, 11, 31, 23, 59, 0) + i * 61);
    times.push(-1, 0, 86_399_999, 86_400_000, 1.5, 1000.25, Number.NaN, 1e20, Date.UTC(9999, 11, 31, 23, 59, 59, 999));
    // Random instants from 1900 to 2100, every millisecond digit and hour of the day.
    const next = sequence(20261202);
    for (let i = 0; i < 20_000; i++) times.push(Math.floor(Date.UTC(1900, 0, 1) + next() * 200 * 365.25 * 86_400_000));
    for (let i = 0; i < 1_000; i++) times.push(Date.UTC(2026, 11, 2) + i * 3_600_001 + i);
    times.push(-0, -8.64e15, 8.64e15, 8.64e15 + 1, Number.POSITIVE_INFINITY);
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
