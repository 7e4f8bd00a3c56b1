import { describe, expect, it } from 'vitest';
import { maximumThuM, maximumTvuM, S44_ORDERS } from './s44-orders.js';

// Source: IHO S-44 Standards for Hydrographic Surveys, Edition 6.0.0 (2020), Table 1 and chapter 3
// ("Maximum Allowable Vertical Uncertainty"), via ../shared/reference/check-values.md §4. The
// derived fixtures (mark C there) are computed from the published formulas; tolerance is half a
// unit in the last published digit.
describe('maximumTvuM', () => {
  it('matches the derived fixtures of check-values.md §4', () => {
    expect(Math.abs(maximumTvuM('special', 10) - 0.261)).toBeLessThanOrEqual(0.00005);
    expect(Math.abs(maximumTvuM('1a', 50) - 0.8201)).toBeLessThanOrEqual(0.00005);
    expect(Math.abs(maximumTvuM('2', 100) - 2.508)).toBeLessThanOrEqual(0.00005);
    expect(Math.abs(maximumTvuM('exclusive', 20) - 0.2121)).toBeLessThanOrEqual(0.00005);
  });

  it('is the a coefficient at the surface (S-44 Table 1 a values)', () => {
    expect(S44_ORDERS.map((o) => maximumTvuM(o.order, 0))).toEqual([0.15, 0.25, 0.5, 0.5, 1]);
  });
});

describe('maximumThuM', () => {
  it('matches the derived fixtures of check-values.md §4', () => {
    expect(maximumThuM('special', 10)).toBe(2);
    expect(maximumThuM('1a', 50)).toBeCloseTo(7.5, 12);
    expect(maximumThuM('2', 100)).toBeCloseTo(30, 12);
    expect(maximumThuM('exclusive', 20)).toBe(1);
  });

  it('follows S-44 Table 1: 1b equals 1a horizontally, order 2 is 20 m + 10 % of depth', () => {
    expect(maximumThuM('1b', 37)).toBe(maximumThuM('1a', 37));
    expect(maximumThuM('2', 0)).toBe(20);
    expect(maximumThuM('2', 200)).toBeCloseTo(40, 12);
  });
});
