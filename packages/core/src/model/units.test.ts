import { describe, expect, it } from 'vitest';
import {
  fromMetres,
  normaliseAzimuthDeg,
  normaliseLongitudeDeg,
  parseLengthUnit,
  parseSpeedUnit,
  toMetres,
  toMetresPerSecond,
} from './units.js';

describe('toMetres', () => {
  it('uses the international foot of exactly 0.3048 m (international yard and pound agreement, 1959)', () => {
    expect(toMetres(1, 'ft')).toBe(0.3048);
    expect(toMetres(100, 'ft')).toBeCloseTo(30.48, 12);
  });

  it('uses the US survey foot of 1200/3937 m (check-values.md, common constants)', () => {
    expect(toMetres(3937, 'us-ft')).toBeCloseTo(1200, 9);
  });

  it('uses the international nautical mile of exactly 1852 m and the fathom of 6 ft', () => {
    expect(toMetres(1, 'nmi')).toBe(1852);
    expect(toMetres(1, 'fathom')).toBeCloseTo(1.8288, 12);
  });

  it('keeps NaN as NaN', () => {
    expect(toMetres(Number.NaN, 'ft')).toBeNaN();
  });
});

describe('fromMetres', () => {
  it('inverts toMetres for every unit', () => {
    for (const unit of ['m', 'km', 'ft', 'us-ft', 'fathom', 'nmi'] as const) {
      expect(fromMetres(toMetres(123.456, unit), unit)).toBeCloseTo(123.456, 9);
    }
  });
});

describe('toMetresPerSecond', () => {
  it('converts knots with 1 kn = 1852 m per hour', () => {
    expect(toMetresPerSecond(1, 'knot')).toBeCloseTo(0.514444, 6);
    expect(toMetresPerSecond(36, 'kmh')).toBeCloseTo(10, 12);
  });
});

describe('normaliseAzimuthDeg', () => {
  it('wraps into [0, 360)', () => {
    expect(normaliseAzimuthDeg(-10)).toBe(350);
    expect(normaliseAzimuthDeg(360)).toBe(0);
    expect(normaliseAzimuthDeg(725)).toBe(5);
    expect(Object.is(normaliseAzimuthDeg(-0), 0)).toBe(true);
  });
});

describe('normaliseLongitudeDeg', () => {
  it('wraps into [-180, 180)', () => {
    expect(normaliseLongitudeDeg(190)).toBe(-170);
    expect(normaliseLongitudeDeg(-190)).toBe(170);
    expect(normaliseLongitudeDeg(180)).toBe(-180);
    expect(normaliseLongitudeDeg(12.5)).toBe(12.5);
  });

  it('returns a longitude already in range untouched, without rounding noise', () => {
    expect(normaliseLongitudeDeg(5.21)).toBe(5.21);
    expect(normaliseLongitudeDeg(-179.999999)).toBe(-179.999999);
  });
});

describe('parseLengthUnit', () => {
  it('reads the unit words loggers write in headers', () => {
    expect(parseLengthUnit('m')).toBe('m');
    expect(parseLengthUnit(' Metres ')).toBe('m');
    expect(parseLengthUnit('ft')).toBe('ft');
    expect(parseLengthUnit('fathoms')).toBe('fathom');
    expect(parseLengthUnit('furlong')).toBeUndefined();
  });
});

describe('parseSpeedUnit', () => {
  it('reads knots and metres per second', () => {
    expect(parseSpeedUnit('kn')).toBe('knot');
    expect(parseSpeedUnit('m/s')).toBe('mps');
    expect(parseSpeedUnit('mph')).toBeUndefined();
  });
});
