import { describe, expect, it } from 'vitest';
import { medianOfEight, neighbourMedian, windowMean } from './robust-window.js';
import { createNormalSampler } from './test-track.js';

function sortedMedian(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 === 1 ? (s[m] as number) : ((s[m - 1] as number) + (s[m] as number)) / 2;
}

describe('medianOfEight', () => {
  it('equals the median by sorting for many random sets, ties included', () => {
    const normal = createNormalSampler(5);
    for (let k = 0; k < 5000; k++) {
      const v = Array.from({ length: 8 }, () => Math.round(normal() * 3) + 0);
      expect(medianOfEight(...(v as [number, number, number, number, number, number, number, number])) + 0).toBe(
        sortedMedian(v) + 0,
      );
    }
    expect(medianOfEight(1, 2, 3, Number.NaN, 5, 6, 7, 8)).toBeNaN();
  });
});

describe('neighbourMedian', () => {
  it('leaves the fix out, shrinks the window symmetrically at the ends and skips NaN', () => {
    const values = Float64Array.from([0, 1, 2, 100, 4, 5, 6, 7, 8, Number.NaN, 10]);
    const out = neighbourMedian(values, 4, new Float64Array(values.length));
    expect(out[0]).toBeNaN(); // no neighbour on one side
    expect(out[1]).toBe(1); // neighbours 0 and 2
    expect(out[3]).toBe(sortedMedian([0, 1, 2, 4, 5, 6]));
    expect(out[4]).toBe(sortedMedian([0, 1, 2, 100, 5, 6, 7, 8]));
    expect(out[7]).toBe(sortedMedian([4, 5, 6, 8, 10])); // 3 each side near the end, index 9 is NaN
  });
});

describe('windowMean', () => {
  it('averages the non-NaN values within the window', () => {
    const out = windowMean(Float64Array.from([1, Number.NaN, 3, 5, 7]), 1, new Float64Array(5));
    expect([...out]).toEqual([1, 2, 4, 5, 6]);
  });
});
