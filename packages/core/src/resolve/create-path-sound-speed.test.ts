import { describe, expect, it } from 'vitest';
import { InvalidArgumentError } from '../errors.js';
import { createPathSoundSpeed } from './create-path-sound-speed.js';
import {
  harmonicMeanSoundSpeed,
  soundSpeedFreshBilaniukWong1993,
  soundSpeedFreshMarczak1997,
  soundSpeedMackenzie1981,
  soundSpeedUnesco1983AtDepth,
} from './sound-speed.js';

/** Travel-time mean of a speed function over [a, b] by the midpoint rule (an independent check). */
function numericMean(speedAt: (z: number) => number, a: number, b: number): number {
  const n = 20_000;
  let slowness = 0;
  for (let i = 0; i < n; i++) slowness += (b - a) / n / speedAt(a + ((i + 0.5) * (b - a)) / n);
  return (b - a) / slowness;
}

describe('createPathSoundSpeed', () => {
  it('gives a constant for a number and for the fresh-water equations', () => {
    expect(createPathSoundSpeed({ method: 'value', soundSpeedMps: 1432, source: 't' }, 50, 60)(2, 40)).toBe(1432);
    expect(createPathSoundSpeed({ method: 'fresh-marczak-1997', temperatureC: 4, source: 't' }, 50, 60)(2, 40)).toBe(
      soundSpeedFreshMarczak1997(4),
    );
    expect(
      createPathSoundSpeed({ method: 'fresh-bilaniuk-wong-1993', temperatureC: 4, source: 't' }, 50, 60)(0, 9),
    ).toBe(soundSpeedFreshBilaniukWong1993(4));
  });

  it('averages Mackenzie 1981 over the path like a numeric integral of the equation', () => {
    const path = createPathSoundSpeed(
      { method: 'mackenzie-1981', temperatureC: 6, salinityPsu: 34, source: 't' },
      300,
      60,
    );
    const exact = numericMean((z) => soundSpeedMackenzie1981(6, 34, z), 1.5, 287.3);
    expect(path(1.5, 287.3)).toBeCloseTo(exact, 6);
    expect(path(287.3, 1.5)).toBeCloseTo(exact, 6);
    expect(path(40, 40)).toBeCloseTo(soundSpeedMackenzie1981(6, 34, 40), 9);
  });

  it('averages UNESCO 1983 at the latitude given', () => {
    const path = createPathSoundSpeed(
      { method: 'unesco-1983', temperatureC: 10, salinityPsu: 35, temperatureScale: 'its90', source: 't' },
      120,
      45,
    );
    const exact = numericMean((z) => soundSpeedUnesco1983AtDepth(10, 35, z, 45), 3, 110);
    expect(path(3, 110)).toBeCloseTo(exact, 6);
  });

  it('uses a measured profile as it is', () => {
    const samples = [
      { depthM: 0, soundSpeedMps: 1470 },
      { depthM: 20, soundSpeedMps: 1460 },
    ];
    const path = createPathSoundSpeed({ method: 'profile', samples, source: 'CTD' }, 20, 60);
    expect(path(2, 18)).toBe(harmonicMeanSoundSpeed(samples, 2, 18));
  });

  it('needs a latitude for UNESCO and a finite depth span for the sea-water equations', () => {
    const unesco = {
      method: 'unesco-1983',
      temperatureC: 10,
      salinityPsu: 35,
      temperatureScale: 'its90',
      source: 't',
    } as const;
    expect(() => createPathSoundSpeed(unesco, 50, Number.NaN)).toThrow(InvalidArgumentError);
    expect(() =>
      createPathSoundSpeed({ method: 'mackenzie-1981', temperatureC: 6, salinityPsu: 34, source: 't' }, Number.NaN, 0),
    ).toThrow(/depth span/);
  });
});
