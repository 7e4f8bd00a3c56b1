import { existsSync, readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { InvalidArgumentError } from '../errors.js';
import { inverseGeodesic } from '../geodesy/geodesic.js';
import { runReferenceTool, seededRandom, shouldRunWith } from '../geodesy/reference-tools.test-helper.js';
import { convertToWgs84 } from './convert-to-wgs84.js';
import { createReprojection } from './create-reprojection.js';
import { parseCrsCode, resolveCrs } from './resolve-crs.js';

describe('parseCrsCode', () => {
  it('reads EPSG:n, epsg:n and bare numbers, and nothing else', () => {
    expect(parseCrsCode('EPSG:25832')).toBe('25832');
    expect(parseCrsCode(' epsg : 4326 ')).toBe('4326');
    expect(parseCrsCode('25832')).toBe('25832');
    expect(parseCrsCode('utm')).toBeUndefined();
    expect(parseCrsCode('EPSG:')).toBeUndefined();
  });
});

describe('resolveCrs', () => {
  it('resolves a projected CRS on a WGS 84-equivalent datum with accuracy 0', () => {
    const crs = resolveCrs('EPSG:25832');
    expect(crs).toMatchObject({ code: 'EPSG:25832', kind: 'projected', method: 'proj4', accuracyM: 0, unit: 'metre' });
    expect(crs.name).toBe('ETRS89 / UTM zone 32N');
    expect(crs.areaOfUse?.west).toBe(6);
  });

  it('refuses unknown codes, non-codes and CRS kinds without a horizontal definition, saying what is valid', () => {
    expect(() => resolveCrs('EPSG:1')).toThrow(InvalidArgumentError);
    expect(() => resolveCrs('mercator')).toThrow(/expected EPSG:<number>/);
    expect(() => resolveCrs('EPSG:5703')).toThrow(/vertical.*expected a geographic or projected CRS/i);
  });

  it('handles EPSG:27700 without OSTN15 on purpose: a Helmert fallback, its accuracy and the grid named', () => {
    const crs = resolveCrs('EPSG:27700');
    expect(crs.method).toBe('helmert-fallback');
    expect(crs.accuracyM).toBe(5);
    expect(crs.note).toMatch(/OSTN15.*Helmert.*5 m/);
    expect(crs.proj4).not.toMatch(/nadgrids/);
    expect(createReprojection(crs).engine).toBe('helmert+transverse-mercator-series');
    const r = createReprojection(crs).forward(Float64Array.of(0.5), Float64Array.of(50.5));
    expect(Number.isFinite(r.x[0] as number) && Number.isFinite(r.y[0] as number)).toBe(true);
  });

  it('refuses a grid it has no file or fallback for, naming the grid', () => {
    // NAD27 geographic (EPSG:4267) needs the Canadian NTv2_0.gsb grid.
    expect(() => resolveCrs('EPSG:4267')).toThrow(/NTv2_0\.gsb/);
  });

  it('keeps the NZGD49 Helmert fallback within its stated (measured) accuracy of the real grid', () => {
    const grid = '/usr/share/proj/nzgd2kgrid0005.gsb';
    if (!existsSync(grid)) {
      if (process.env.CI) throw new Error(`${grid} (Debian proj-data) is missing`);
      console.warn(`skipping the NZGD49 grid check: ${grid} (Debian proj-data) is not installed`);
      return;
    }
    const withGrid = resolveCrs('EPSG:27200', { grids: { 'nzgd2kgrid0005.gsb': new Uint8Array(readFileSync(grid)) } });
    const fallback = resolveCrs('EPSG:27200');
    const random = seededRandom(27200);
    const n = 500;
    const lon = Float64Array.from({ length: n }, () => 166.4 + random() * 12.2);
    const lat = Float64Array.from({ length: n }, () => -47.3 + random() * 13.2);
    const a = createReprojection(withGrid).forward(lon, lat);
    const b = createReprojection(fallback).forward(lon, lat);
    let worstM = 0;
    for (let i = 0; i < n; i++)
      worstM = Math.max(
        worstM,
        Math.hypot((a.x[i] as number) - (b.x[i] as number), (a.y[i] as number) - (b.y[i] as number)),
      );
    expect(worstM).toBeLessThanOrEqual(fallback.accuracyM ?? 0);
  });

  const betaGrid = '/usr/share/proj/BETA2007.gsb';
  const haveGrid = existsSync(betaGrid);
  it('uses a grid the caller supplies, and the DHDN Helmert fallback stays within its stated accuracy of it', () => {
    if (!haveGrid) {
      if (process.env.CI) throw new Error(`${betaGrid} (Debian proj-data) is missing`);
      console.warn(`skipping the supplied-grid check: ${betaGrid} (Debian proj-data) is not installed`);
      return;
    }
    const bytes = readFileSync(betaGrid);
    const withGrid = resolveCrs('EPSG:31467', { grids: { 'BETA2007.gsb': new Uint8Array(bytes) } });
    expect(withGrid.method).toBe('proj4-with-grid');
    const fallback = resolveCrs('EPSG:31467');
    expect(fallback.method).toBe('helmert-fallback');
    const random = seededRandom(31467);
    const n = 200;
    const lon = new Float64Array(n);
    const lat = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      lon[i] = 7.5 + random() * 3;
      lat[i] = 48 + random() * 6;
    }
    const a = createReprojection(withGrid).forward(lon, lat);
    const b = createReprojection(fallback).forward(lon, lat);
    let worstM = 0;
    for (let i = 0; i < n; i++)
      worstM = Math.max(
        worstM,
        Math.hypot((a.x[i] as number) - (b.x[i] as number), (a.y[i] as number) - (b.y[i] as number)),
      );
    expect(worstM).toBeLessThanOrEqual(fallback.accuracyM ?? 0);
    expect(worstM).toBeGreaterThan(0.01); // the grid really was used
    if (!shouldRunWith('/usr/bin/cs2cs')) return;
    // The supplied grid matches PROJ using the same grid (≤ 1 mm).
    const out = runReferenceTool(
      '/usr/bin/cs2cs',
      ['-f', '%.6f', '+proj=longlat', '+datum=WGS84', '+no_defs', '+to', ...withGrid.proj4.split(/\s+/)],
      `${Array.from(lon, (v, i) => `${v} ${lat[i]}`).join('\n')}\n`,
    )
      .trim()
      .split('\n');
    let worstProjM = 0;
    out.forEach((line, i) => {
      const [x, y] = line.trim().split(/\s+/).map(Number) as [number, number];
      worstProjM = Math.max(worstProjM, Math.hypot((a.x[i] as number) - x, (a.y[i] as number) - y));
    });
    expect(worstProjM).toBeLessThanOrEqual(0.001);
  });
});

describe('convertToWgs84', () => {
  it('converts EPSG:25832 (500000.00, 5538630.70) back to (9°E, 50°N) (STACK.md regression value)', () => {
    const r = convertToWgs84('EPSG:25832', Float64Array.of(500000), Float64Array.of(5538630.7));
    expect(inverseGeodesic(r.latDeg[0] as number, r.lonDeg[0] as number, 50, 9).distanceM).toBeLessThan(0.006);
    expect(r.failedIndices).toEqual([]);
    expect(r.accuracyM).toBe(0);
  });

  it('converts British National Grid with the Helmert fallback, says so, and never returns NaN for a valid row', () => {
    const r = convertToWgs84('27700', Float64Array.of(577274.99, 400000), Float64Array.of(69740.5, 500000));
    expect(r.method).toMatch(/Helmert/);
    expect(r.accuracyM).toBe(5);
    for (const v of [...r.latDeg, ...r.lonDeg]) expect(Number.isFinite(v)).toBe(true);
    // OSGB36 (50.5°N, 0.5°E) lies about 100 m from the same numbers on WGS 84 (from memory: the
    // OSGB36–WGS 84 offset is of the order of 100 m in south-east England).
    const d = inverseGeodesic(r.latDeg[0] as number, r.lonDeg[0] as number, 50.5, 0.5).distanceM;
    expect(d).toBeGreaterThan(50);
    expect(d).toBeLessThan(200);
  });

  it('lists unconvertible rows and leaves NaN rows NaN', () => {
    const r = convertToWgs84('EPSG:3857', Float64Array.of(0, Number.NaN), Float64Array.of(0, 1));
    expect(r.latDeg[0]).toBeCloseTo(0, 12);
    expect(r.latDeg[1]).toBeNaN();
    expect(r.failedIndices).toEqual([]);
  });
});
