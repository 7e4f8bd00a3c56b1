import { execFileSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { createLocalFrame } from '@leadline/core';
import { describe, expect, it } from 'vitest';
import { createLocalGrid, createProjectedGrid, formatNumber, utmChoiceFor, utmZoneOf } from './grid-system';

describe('utmZoneOf', () => {
  it('uses the regular 6° zones', () => {
    expect(utmZoneOf(50, 9)).toEqual({ zone: 32, south: false });
    expect(utmZoneOf(-33.9, 18.4)).toEqual({ zone: 34, south: true });
    expect(utmZoneOf(10, -180)).toEqual({ zone: 1, south: false });
  });

  it('applies the south-west Norway and Svalbard exceptions (UTM zone definition, from memory)', () => {
    // 59° N 5.6° E is in 31V by the regular rule but 32V is widened west to 3° E.
    expect(utmZoneOf(59.04, 5.61).zone).toBe(32);
    expect(utmZoneOf(78.2, 15.6).zone).toBe(33);
    expect(utmZoneOf(78.2, 8).zone).toBe(31);
  });
});

describe('utmChoiceFor', () => {
  it('names the WGS 84 UTM CRS by its EPSG code', () => {
    expect(utmChoiceFor(59.04, 5.61)).toMatchObject({ code: 'EPSG:32632', name: 'WGS 84 / UTM zone 32N' });
    expect(utmChoiceFor(-33.9, 18.4).code).toBe('EPSG:32734');
  });
});

describe('formatNumber', () => {
  it('groups thousands with thin spaces and keeps decimals only as the step needs', () => {
    expect(formatNumber(6549567, 100)).toBe('6\u2009549\u2009567');
    expect(formatNumber(-12.5, 0.5)).toBe('\u221212.5');
    expect(formatNumber(0.25, 0.05)).toBe('0.25');
    expect(formatNumber(-0.0001, 1)).toBe('0');
  });
});

describe('createLocalGrid', () => {
  it('is the local frame itself', () => {
    const grid = createLocalGrid();
    const e = Float64Array.of(1, 2);
    const n = Float64Array.of(3, 4);
    expect(grid.toGrid(e, n)).toEqual({ x: e, y: n });
  });
});

describe('createProjectedGrid', () => {
  const frame = createLocalFrame(59.0412, 5.6127);
  const grid = createProjectedGrid(utmChoiceFor(59.0412, 5.6127), frame);

  it('labels the local origin with its UTM easting and northing as PROJ cs2cs gives them', () => {
    const { x, y } = grid.toGrid(Float64Array.of(0), Float64Array.of(0));
    // Reference: PROJ `cs2cs +proj=longlat +datum=WGS84 +to +proj=utm +zone=32 +datum=WGS84`
    // on 5.6127 E 59.0412 N; run here when installed, else the value it printed on this machine.
    let expected = [305677.623, 6549567.677];
    if (existsSync('/usr/bin/cs2cs')) {
      const out = execFileSync(
        '/usr/bin/cs2cs',
        ['+proj=longlat', '+datum=WGS84', '+to', '+proj=utm', '+zone=32', '+datum=WGS84', '-f', '%.3f'],
        { input: '5.6127 59.0412\n', encoding: 'utf8' },
      );
      expected = out.trim().split(/\s+/).slice(0, 2).map(Number);
    }
    expect(x[0]).toBeCloseTo(expected[0] as number, 2);
    expect(y[0]).toBeCloseTo(expected[1] as number, 2);
  });

  it('goes back from grid coordinates to the same local metres', () => {
    const e = Float64Array.of(-120, 0, 85.5);
    const n = Float64Array.of(40, 0, -60.25);
    const g = grid.toGrid(e, n);
    const back = grid.fromGrid(g.x, g.y);
    for (let i = 0; i < 3; i++) {
      expect(back.eastM[i]).toBeCloseTo(e[i] as number, 4);
      expect(back.northM[i]).toBeCloseTo(n[i] as number, 4);
    }
  });

  it('refuses a definition proj4 cannot read', () => {
    expect(() => createProjectedGrid({ code: 'EPSG:1', name: 'nonsense', proj4: '+proj=nosuch' }, frame)).toThrow();
  });
});
