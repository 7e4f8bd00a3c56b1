import { describe, expect, it } from 'vitest';
import { summariseMovement } from './summarise-movement.js';

describe('summariseMovement', () => {
  it('gives median, 95th percentile (type 7), max, mean and RMS, skipping NaN', () => {
    // 1..20 m: median (10 + 11) / 2 = 10.5; type-7 p95 at rank 0.95 · 19 = 18.05 → 19 + 0.05 · 1 = 19.05.
    const values = [Number.NaN, ...Array.from({ length: 20 }, (_, i) => 20 - i), Number.NaN];
    const s = summariseMovement(values);
    expect(s.comparedCount).toBe(20);
    expect(s.medianM).toBeCloseTo(10.5, 12);
    expect(s.p95M).toBeCloseTo(19.05, 12);
    expect(s.maxM).toBe(20);
    expect(s.meanM).toBeCloseTo(10.5, 12);
    // Σ k² for k = 1..20 is 2870.
    expect(s.rmsM).toBeCloseTo(Math.sqrt(2870 / 20), 12);
  });

  it('returns NaN statistics for nothing to compare', () => {
    const s = summariseMovement(new Float64Array([Number.NaN]));
    expect(s.comparedCount).toBe(0);
    expect(s.medianM).toBeNaN();
    expect(s.maxM).toBeNaN();
  });

  it('handles a single value', () => {
    expect(summariseMovement([3])).toMatchObject({ medianM: 3, p95M: 3, maxM: 3 });
  });
});
