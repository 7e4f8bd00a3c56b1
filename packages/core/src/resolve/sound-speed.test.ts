import { describe, expect, it } from 'vitest';
import { InvalidArgumentError } from '../errors.js';
import {
  depthFromPressureUnesco1983,
  harmonicMeanSoundSpeed,
  pressureFromDepthUnesco1983,
  soundSpeedFreshBilaniukWong1993,
  soundSpeedFreshMarczak1997,
  soundSpeedMackenzie1981,
  soundSpeedUnesco1983,
  soundSpeedUnesco1983AtDepth,
} from './sound-speed.js';

describe('soundSpeedMackenzie1981', () => {
  it('matches the published check value', () => {
    // Mackenzie (1981), J. Acoust. Soc. Am. 70(3) 807–812: T = 25 °C, S = 35, D = 1000 m → 1550.744 m/s
    // (check-values.md §3, conf. T; tolerance half a unit in the last digit).
    expect(soundSpeedMackenzie1981(25, 35, 1000)).toBeCloseTo(1550.744, 3);
  });

  it('rises with temperature, salinity and depth in the valid range', () => {
    const base = soundSpeedMackenzie1981(10, 35, 100);
    expect(soundSpeedMackenzie1981(11, 35, 100)).toBeGreaterThan(base);
    expect(soundSpeedMackenzie1981(10, 36, 100)).toBeGreaterThan(base);
    expect(soundSpeedMackenzie1981(10, 35, 200)).toBeGreaterThan(base);
  });

  it('passes NaN through', () => {
    expect(soundSpeedMackenzie1981(Number.NaN, 35, 0)).toBeNaN();
  });
});

describe('soundSpeedUnesco1983', () => {
  it('matches the UNESCO 44 check value', () => {
    // Fofonoff & Millard (1983), UNESCO Tech. Pap. Mar. Sci. 44, SVEL CHECKVALUE:
    // S = 40, T = 40 °C (IPTS-68), P = 10000 dbar → 1731.995 m/s (check-values.md §3, conf. T).
    expect(soundSpeedUnesco1983(40, 40, 10000, { temperatureScale: 'ipts68' })).toBeCloseTo(1731.995, 3);
  });

  it('matches the computed regression point at the surface', () => {
    // check-values.md §3 "extra regression points", conf. C (computed, not published): SVEL(35, 0, 0) = 1449.139.
    expect(soundSpeedUnesco1983(0, 35, 0, { temperatureScale: 'ipts68' })).toBeCloseTo(1449.139, 3);
  });

  it('converts ITS-90 to IPTS-68 by default (T68 = 1.00024 T90)', () => {
    expect(soundSpeedUnesco1983(20, 35, 0)).toBeCloseTo(
      soundSpeedUnesco1983(20 * 1.00024, 35, 0, { temperatureScale: 'ipts68' }),
      9,
    );
    expect(soundSpeedUnesco1983(20, 35, 0)).not.toBe(soundSpeedUnesco1983(20, 35, 0, { temperatureScale: 'ipts68' }));
  });

  it('agrees with Mackenzie within 0.5 m/s in ordinary coastal water', () => {
    // Both equations fit the same measurements; at 10 °C, S 35, 50 m they differ by a few tenths (common practice).
    const depthM = 50;
    const unesco = soundSpeedUnesco1983AtDepth(10, 35, depthM, 60);
    expect(Math.abs(unesco - soundSpeedMackenzie1981(10, 35, depthM))).toBeLessThan(0.5);
  });
});

describe('depthFromPressureUnesco1983', () => {
  it('matches the UNESCO 44 check value', () => {
    // Fofonoff & Millard (1983), DEPTH CHECKVALUE: P = 10000 dbar, latitude 30° → 9712.653 m (check-values.md §3, conf. T).
    expect(depthFromPressureUnesco1983(10000, 30)).toBeCloseTo(9712.653, 3);
  });
});

describe('pressureFromDepthUnesco1983', () => {
  it('inverts the UNESCO DEPTH routine', () => {
    // Round trip through the published check value (UNESCO 44 DEPTH, 10000 dbar at 30° ↔ 9712.653 m).
    expect(pressureFromDepthUnesco1983(9712.653, 30)).toBeCloseTo(10000, 3);
    for (const depthM of [0, 5, 42.5, 300]) {
      expect(depthFromPressureUnesco1983(pressureFromDepthUnesco1983(depthM, 59), 59)).toBeCloseTo(depthM, 8);
    }
  });

  it('rejects negative depth and passes NaN through', () => {
    expect(() => pressureFromDepthUnesco1983(-1, 0)).toThrow(InvalidArgumentError);
    expect(pressureFromDepthUnesco1983(Number.NaN, 0)).toBeNaN();
  });
});

describe('soundSpeedUnesco1983AtDepth', () => {
  it('equals SVEL at the pressure of that depth', () => {
    const p = pressureFromDepthUnesco1983(120, 45);
    expect(soundSpeedUnesco1983AtDepth(8, 34, 120, 45)).toBe(soundSpeedUnesco1983(8, 34, p));
  });
});

describe('soundSpeedFreshMarczak1997', () => {
  it('reproduces the computed values from the published coefficients', () => {
    // Marczak (1997), J. Acoust. Soc. Am. 102, 2776, NPL coefficients. These are computed values
    // (check-values.md §3, conf. C: regression values, not published check values).
    expect(soundSpeedFreshMarczak1997(0)).toBeCloseTo(1402.385, 3);
    expect(soundSpeedFreshMarczak1997(10)).toBeCloseTo(1447.289, 3);
    expect(soundSpeedFreshMarczak1997(20)).toBeCloseTo(1482.38, 3);
    expect(soundSpeedFreshMarczak1997(25)).toBeCloseTo(1496.728, 3);
  });
});

describe('soundSpeedFreshBilaniukWong1993', () => {
  it('reproduces the computed values from the published coefficients', () => {
    // Bilaniuk & Wong (1993), J. Acoust. Soc. Am. 93, 1609, 148-point fit. Computed values
    // (check-values.md §3, conf. C: regression values, not published check values).
    expect(soundSpeedFreshBilaniukWong1993(0)).toBeCloseTo(1402.387, 3);
    expect(soundSpeedFreshBilaniukWong1993(10)).toBeCloseTo(1447.279, 3);
    expect(soundSpeedFreshBilaniukWong1993(20)).toBeCloseTo(1482.358, 3);
    expect(soundSpeedFreshBilaniukWong1993(25)).toBeCloseTo(1496.704, 3);
  });

  it('agrees with Marczak within 0.05 m/s at 0–30 °C', () => {
    for (let t = 0; t <= 30; t += 5)
      expect(Math.abs(soundSpeedFreshBilaniukWong1993(t) - soundSpeedFreshMarczak1997(t))).toBeLessThan(0.05);
  });
});

describe('harmonicMeanSoundSpeed', () => {
  const profile = [
    { depthM: 0, soundSpeedMps: 1500 },
    { depthM: 100, soundSpeedMps: 1400 },
  ];

  it('is the travel-time mean of a linear gradient (closed form Δc / ln(c1/c0))', () => {
    const expected = (1500 - 1400) / Math.log(1500 / 1400);
    expect(harmonicMeanSoundSpeed(profile, 0, 100)).toBeCloseTo(expected, 9);
    // Order of the two depths does not matter.
    expect(harmonicMeanSoundSpeed(profile, 100, 0)).toBeCloseTo(expected, 9);
  });

  it('matches a numeric integral of the slowness over a multi-layer span', () => {
    const layered = [
      { depthM: 2, soundSpeedMps: 1480 },
      { depthM: 10, soundSpeedMps: 1470 },
      { depthM: 30, soundSpeedMps: 1455 },
      { depthM: 60, soundSpeedMps: 1452 },
    ];
    const from = 1;
    const to = 45;
    // Midpoint-rule integral of dz / c(z), c linearly interpolated, constant above 2 m.
    const speedAt = (z: number): number => {
      if (z <= 2) return 1480;
      if (z <= 10) return 1480 + ((z - 2) / 8) * -10;
      if (z <= 30) return 1470 + ((z - 10) / 20) * -15;
      return 1455 + ((z - 30) / 30) * -3;
    };
    const n = 200_000;
    let integral = 0;
    for (let i = 0; i < n; i++) integral += (to - from) / n / speedAt(from + ((i + 0.5) * (to - from)) / n);
    expect(harmonicMeanSoundSpeed(layered, from, to)).toBeCloseTo((to - from) / integral, 6);
  });

  it('returns the interpolated speed for a zero span and the end value beyond the profile', () => {
    expect(harmonicMeanSoundSpeed(profile, 50, 50)).toBeCloseTo(1450, 9);
    expect(harmonicMeanSoundSpeed(profile, 150, 200)).toBe(1400);
  });

  it('rejects an unusable profile', () => {
    expect(() => harmonicMeanSoundSpeed([], 0, 1)).toThrow(InvalidArgumentError);
    expect(() =>
      harmonicMeanSoundSpeed(
        [
          { depthM: 5, soundSpeedMps: 1500 },
          { depthM: 5, soundSpeedMps: 1490 },
        ],
        0,
        1,
      ),
    ).toThrow(/increase/);
    expect(() => harmonicMeanSoundSpeed([{ depthM: 0, soundSpeedMps: 0 }], 0, 1)).toThrow(/positive speed/);
  });
});
