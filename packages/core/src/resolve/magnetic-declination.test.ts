import { describe, expect, it } from 'vitest';
import { InvalidArgumentError } from '../errors.js';
import { decimalYearFromTimeMs, magneticDeclination } from './magnetic-declination.js';

/** The UTC instant of a WMM decimal year (fraction of the calendar year). */
function timeMsOfDecimalYear(decimalYear: number): number {
  const year = Math.floor(decimalYear);
  const start = Date.UTC(year, 0, 1);
  return start + (decimalYear - year) * (Date.UTC(year + 1, 0, 1) - start);
}

describe('decimalYearFromTimeMs', () => {
  it('is the fraction of the calendar year', () => {
    // check-values.md §6: "2025-07-02T12:00Z = 2025.5".
    expect(decimalYearFromTimeMs(Date.UTC(2025, 6, 2, 12))).toBeCloseTo(2025.5, 12);
    // A leap year has 366 days: noon on 2 July 2028 is 183.5 / 366 of the way through.
    expect(decimalYearFromTimeMs(Date.UTC(2028, 6, 2, 12))).toBeCloseTo(2028 + 183.5 / 366, 12);
  });
});

describe('magneticDeclination', () => {
  // NOAA/NCEI WMM2025_TEST_VALUES.txt (check-values.md §6, conf. T): year, height (km), lat, lon, D (°).
  // Published precision 0.01°, so the tolerance is half of that.
  const wmm2025TestValues: ReadonlyArray<readonly [number, number, number, number, number]> = [
    [2025.0, 0, 80, 0, 1.28],
    [2025.0, 0, 0, 120, -0.16],
    [2025.0, 0, -80, 240, 68.78],
    [2025.0, 100, 80, 0, 0.85],
    [2025.0, 100, 0, 120, -0.15],
    [2025.0, 100, -80, 240, 68.21],
    [2027.5, 0, 80, 0, 2.59],
    [2027.5, 0, 0, 120, -0.24],
    [2027.5, 0, -80, 240, 68.49],
    [2027.5, 100, 80, 0, 2.16],
    [2027.5, 100, 0, 120, -0.23],
    [2027.5, 100, -80, 240, 67.93],
  ];

  it.each(wmm2025TestValues)('matches the WMM2025 test value at %d, %d km, %d°, %d°', (year, heightKm, lat, lon, d) => {
    const result = magneticDeclination(lat, lon, timeMsOfDecimalYear(year), heightKm * 1000);
    expect(Math.abs(result.declinationDeg - d)).toBeLessThanOrEqual(0.005);
    expect(result.modelName).toBe('WMM-2025');
    expect(result.decimalYear).toBeCloseTo(year, 9);
  });

  it('matches the GeographicLib MagneticField(1) manual example (Timbuktu)', () => {
    // GeographicLib MagneticField(1) manual, WMM2025: 2025-01-01, 16:46:33N 3:00:34W, h = 300 m → D = −1.04°
    // (check-values.md §6 "Other checks", conf. S).
    const lat = 16 + 46 / 60 + 33 / 3600;
    const lon = -(3 + 0 / 60 + 34 / 3600);
    const result = magneticDeclination(lat, lon, Date.UTC(2025, 0, 1), 300);
    expect(Math.abs(result.declinationDeg - -1.04)).toBeLessThanOrEqual(0.005);
  });

  it('refuses a time no bundled model covers, and non-finite input', () => {
    expect(() => magneticDeclination(60, 5, Date.UTC(2035, 0, 1))).toThrow(InvalidArgumentError);
    expect(() => magneticDeclination(Number.NaN, 5, Date.UTC(2025, 0, 1))).toThrow(/finite/);
  });
});
