import { describe, expect, it } from 'vitest';
import { inverseGeodesic } from '../geodesy/geodesic.js';
import { dms, runReferenceTool, seededRandom, shouldRunWith } from '../geodesy/reference-tools.test-helper.js';
import { createReprojection } from './create-reprojection.js';
import { type ResolvedCrs, resolveCrs } from './resolve-crs.js';

/** A CRS built from the parameters a check-values.md row gives (no datum shift: pure projection). */
function crsFrom(proj4: string, kind: ResolvedCrs['kind'] = 'projected'): ResolvedCrs {
  return {
    code: 'test',
    name: 'test',
    kind,
    proj4,
    method: 'proj4',
    accuracyM: 0,
    note: '',
    areaOfUse: undefined,
    unit: 'metre',
  };
}

function forward1(crs: ResolvedCrs, latDeg: number, lonDeg: number): [number, number] {
  const r = createReprojection(crs).forward(Float64Array.of(lonDeg), Float64Array.of(latDeg));
  return [r.x[0] as number, r.y[0] as number];
}

function inverse1(crs: ResolvedCrs, x: number, y: number): [number, number] {
  const r = createReprojection(crs).inverse(Float64Array.of(x), Float64Array.of(y));
  return [r.y[0] as number, r.x[0] as number];
}

// Tolerance: half a unit in the last published digit (check-values.md, preamble).
const HALF_CM = 0.005;

describe('createReprojection', () => {
  it('Transverse Mercator 9807, OSGB 1936 / BNG with the printed k0 (EPSG method 9807 record, check-values.md §1.1)', () => {
    const crs = crsFrom('+proj=tmerc +lat_0=49 +lon_0=-2 +k=0.9996013 +x_0=400000 +y_0=-100000 +ellps=airy +units=m');
    const [e, n] = forward1(crs, 50.5, 0.5);
    expect(Math.abs(e - 577274.99)).toBeLessThanOrEqual(HALF_CM);
    expect(Math.abs(n - 69740.5)).toBeLessThanOrEqual(HALF_CM);
  });

  it('Lambert Conic Conformal 2SP 9802, NAD27 / Texas South Central in US feet (EPSG method 9802 record, check-values.md §1.1)', () => {
    const crs = crsFrom(
      `+proj=lcc +lat_1=${dms(28, 23, 0)} +lat_2=${dms(30, 17, 0)} +lat_0=${dms(27, 50, 0)} +lon_0=-99 +x_0=${2000000 * (1200 / 3937)} +y_0=0 +a=6378206.4 +rf=294.9786982 +units=us-ft`,
    );
    const [e, n] = forward1(crs, 28.5, -96);
    expect(Math.abs(e - 2963503.91)).toBeLessThanOrEqual(HALF_CM);
    expect(Math.abs(n - 254759.8)).toBeLessThanOrEqual(HALF_CM);
    const [lat, lon] = inverse1(crs, e, n);
    expect(lat).toBeCloseTo(28.5, 9);
    expect(lon).toBeCloseTo(-96, 9);
  });

  it('Mercator variant A 9804, Makassar / NEIEZ (EPSG 9804 record and GeoAPI SamplePoints, check-values.md §1.1)', () => {
    const crs = crsFrom('+proj=merc +lon_0=110 +k_0=0.997 +x_0=3900000 +y_0=900000 +a=6377397.155 +rf=299.1528128');
    const [e, n] = forward1(crs, -3, 120);
    expect(Math.abs(e - 5009726.58)).toBeLessThanOrEqual(HALF_CM);
    expect(Math.abs(n - 569150.82)).toBeLessThanOrEqual(HALF_CM);
  });

  it('Mercator variant B 9805, Pulkovo 1942 / Caspian Sea Mercator (EPSG method 9805 record, check-values.md §1.1)', () => {
    const crs = crsFrom('+proj=merc +lat_ts=42 +lon_0=51 +x_0=0 +y_0=0 +a=6378245 +rf=298.3');
    const [e, n] = forward1(crs, 53, 53);
    expect(Math.abs(e - 165704.29)).toBeLessThanOrEqual(HALF_CM);
    expect(Math.abs(n - 5171848.07)).toBeLessThanOrEqual(HALF_CM);
  });

  it('Popular Visualisation Pseudo-Mercator 1024 through EPSG:3857 (EPSG method 1024 record, check-values.md §1.1)', () => {
    const crs = resolveCrs('EPSG:3857');
    expect(createReprojection(crs).engine).toBe('mercator');
    const [e, n] = forward1(crs, dms(24, 22, 54.433), dms(100, 20, 0, true));
    expect(Math.abs(e - -11169055.58)).toBeLessThanOrEqual(HALF_CM);
    expect(Math.abs(n - 2800000.0)).toBeLessThanOrEqual(HALF_CM);
    const [lat, lon] = inverse1(crs, -11169055.58, 2810000.0);
    expect(Math.abs(lat - dms(24, 27, 48.889)) * 3600).toBeLessThanOrEqual(0.0005);
    expect(Math.abs(lon - dms(100, 20, 0, true)) * 3600).toBeLessThanOrEqual(0.0005);
  });

  it('Mercator (Spherical) 1026 on R = 6371007 m (GeoAPI suite and PROJ builtins.gie, check-values.md §1.1)', () => {
    const crs = crsFrom('+proj=merc +R=6371007 +lon_0=0 +x_0=0 +y_0=0');
    const [e, n] = forward1(crs, dms(24, 22, 54.433), dms(100, 20, 0, true));
    expect(Math.abs(e - -11156569.9)).toBeLessThanOrEqual(HALF_CM);
    expect(Math.abs(n - 2796869.94)).toBeLessThanOrEqual(HALF_CM);
  });

  it('Polar Stereographic variant A 9810, WGS 84 / UPS North (EPSG method 9810 record, check-values.md §1.1)', () => {
    const crs = resolveCrs('EPSG:32661');
    const [e, n] = forward1(crs, 73, 44);
    expect(Math.abs(e - 3320416.75)).toBeLessThanOrEqual(HALF_CM);
    expect(Math.abs(n - 632668.43)).toBeLessThanOrEqual(HALF_CM);
    const [lat, lon] = inverse1(crs, 3320416.75, 632668.43);
    expect(Math.abs(lat - 73) * 3600).toBeLessThanOrEqual(0.0005);
    expect(Math.abs(lon - 44) * 3600).toBeLessThanOrEqual(0.0005);
  });

  it('uses the fast series for UTM on a WGS 84-equivalent datum: (9°E, 50°N) → EPSG:25832 (500000.00, 5538630.70), STACK.md regression value', () => {
    const crs = resolveCrs('25832');
    expect(createReprojection(crs).engine).toBe('transverse-mercator-series');
    const [e, n] = forward1(crs, 50, 9);
    expect(Math.abs(e - 500000)).toBeLessThanOrEqual(HALF_CM);
    expect(Math.abs(n - 5538630.7)).toBeLessThanOrEqual(HALF_CM);
  });

  it('uses its own code for the common methods and says which (engine names are part of the output)', () => {
    const engines = Object.fromEntries(
      ['EPSG:32632', 'EPSG:3857', 'EPSG:3035', 'EPSG:2154', 'EPSG:3031', 'EPSG:27700', 'EPSG:28992', 'EPSG:4326'].map(
        (code) => [code, createReprojection(resolveCrs(code)).engine],
      ),
    );
    expect(engines).toEqual({
      'EPSG:32632': 'transverse-mercator-series',
      'EPSG:3857': 'mercator',
      'EPSG:3035': 'lambert-azimuthal-equal-area',
      'EPSG:2154': 'lambert-conformal-conic',
      'EPSG:3031': 'polar-stereographic',
      'EPSG:27700': 'helmert+transverse-mercator-series',
      'EPSG:28992': 'helmert+proj4',
      'EPSG:4326': 'geographic',
    });
  });

  it('lists the rows it could not convert and keeps NaN rows NaN without listing them', () => {
    const crs = resolveCrs('EPSG:3857');
    const r = createReprojection(crs).forward(Float64Array.of(0, Number.NaN, 0), Float64Array.of(0, 10, 90));
    expect(r.failedIndices).toEqual([2]);
    expect(r.x[1]).toBeNaN();
    expect(r.y[2]).toBeNaN();
  });

  describe('against PROJ cs2cs on random points (≤ 1 mm, one cs2cs run per CRS)', () => {
    const codes = [
      'EPSG:25832',
      'EPSG:32633',
      'EPSG:32759',
      'EPSG:3857',
      'EPSG:3035',
      'EPSG:2154',
      'EPSG:27700',
      'EPSG:3031',
      'EPSG:3413', // polar stereographic variant B, north
      'EPSG:32661', // UPS North, polar stereographic variant A
      'EPSG:3034', // LCC 2SP, ETRS89
      'EPSG:2278', // LCC 2SP in US survey feet, NAD83 Texas South Central
      'EPSG:28992', // oblique stereographic through proj4 after a 7-parameter Helmert shift
      'EPSG:2056', // Swiss oblique Mercator through proj4 after a 3-parameter shift
      'EPSG:4277', // geographic OSGB 1936: the Helmert shift alone
      'EPSG:23031', // ED50 / UTM 31N: a 3-parameter shift before the Transverse Mercator series
    ];
    const run = shouldRunWith('/usr/bin/cs2cs');
    for (const code of codes) {
      it(`${code} forward and inverse`, () => {
        if (!run) return;
        const crs = resolveCrs(code);
        const box = crs.areaOfUse;
        if (!box) throw new Error(`${code} has no area of use`);
        const random = seededRandom(code.length * 1000 + Number(code.slice(5)));
        const n = 400;
        const lon = new Float64Array(n);
        const lat = new Float64Array(n);
        const width = box.west <= box.east ? box.east - box.west : box.east + 360 - box.west;
        for (let i = 0; i < n; i++) {
          lon[i] = Number((((box.west + random() * width + 180) % 360) - 180).toFixed(9));
          lat[i] = Number((box.south + random() * (box.north - box.south)).toFixed(9));
        }
        const input = Array.from(lon, (v, i) => `${v} ${lat[i]}`).join('\n');
        const out = runReferenceTool(
          '/usr/bin/cs2cs',
          [
            '-f',
            crs.kind === 'geographic' ? '%.11f' : '%.6f',
            '+proj=longlat',
            '+datum=WGS84',
            '+no_defs',
            '+to',
            ...crs.proj4.split(/\s+/),
          ],
          `${input}\n`,
        )
          .trim()
          .split('\n');
        const reprojection = createReprojection(crs);
        const ours = reprojection.forward(lon, lat);
        const theirX = new Float64Array(n);
        const theirY = new Float64Array(n);
        let worstForwardM = 0;
        for (let i = 0; i < n; i++) {
          const [x, y] = (out[i] as string).trim().split(/\s+/).map(Number) as [number, number];
          theirX[i] = x;
          theirY[i] = y;
          const missM =
            crs.kind === 'geographic'
              ? inverseGeodesic(ours.y[i] as number, ours.x[i] as number, y, x).distanceM
              : Math.hypot((ours.x[i] as number) - x, (ours.y[i] as number) - y);
          worstForwardM = Math.max(worstForwardM, missM);
        }
        expect(worstForwardM).toBeLessThanOrEqual(0.001);
        const back = reprojection.inverse(theirX, theirY);
        let worstInverseM = 0;
        for (let i = 0; i < n; i++)
          worstInverseM = Math.max(
            worstInverseM,
            inverseGeodesic(back.y[i] as number, back.x[i] as number, lat[i] as number, lon[i] as number).distanceM,
          );
        expect(worstInverseM).toBeLessThanOrEqual(0.001);
      });
    }

    // The proj4-backed methods start each point of a track from the previous one (then one Newton
    // step), not from proj4's inverse: the same ≤ 1 mm against PROJ along 1 Hz tracks.
    for (const code of ['EPSG:28992', 'EPSG:5514', 'EPSG:3375', 'EPSG:2056']) {
      it(`${code} inverse along a track`, () => {
        if (!run) return;
        const crs = resolveCrs(code);
        const box = crs.areaOfUse;
        if (!box) throw new Error(`${code} has no area of use`);
        const n = 3000;
        const lon = new Float64Array(n);
        const lat = new Float64Array(n);
        const lat0 = (box.south + box.north) / 2;
        const lon0 = (box.west + box.east) / 2;
        for (let i = 0; i < n; i++) {
          // About 1 m/s with turns, and one 5 km jump (a new dive) halfway.
          lat[i] = Number((lat0 + 0.004 * Math.sin(i / 200) + (i >= n / 2 ? 0.05 : 0)).toFixed(9));
          lon[i] = Number((lon0 + 0.006 * Math.cos(i / 300)).toFixed(9));
        }
        const input = Array.from(lon, (v, i) => `${v} ${lat[i]}`).join('\n');
        const out = runReferenceTool(
          '/usr/bin/cs2cs',
          ['-f', '%.6f', '+proj=longlat', '+datum=WGS84', '+no_defs', '+to', ...crs.proj4.split(/\s+/)],
          `${input}\n`,
        )
          .trim()
          .split('\n');
        const theirX = new Float64Array(n);
        const theirY = new Float64Array(n);
        for (let i = 0; i < n; i++) {
          const [x, y] = (out[i] as string).trim().split(/\s+/).map(Number) as [number, number];
          theirX[i] = x;
          theirY[i] = y;
        }
        const back = createReprojection(crs).inverse(theirX, theirY);
        let worstM = 0;
        for (let i = 0; i < n; i++)
          worstM = Math.max(
            worstM,
            inverseGeodesic(back.y[i] as number, back.x[i] as number, lat[i] as number, lon[i] as number).distanceM,
          );
        expect(worstM).toBeLessThanOrEqual(0.001);
      });
    }
  });
});
