import { describe, expect, it } from 'vitest';
import { inverseGeodesic } from './geodesic.js';
import { createHelmertShift, shiftColumns } from './helmert-shift.js';

const ARCSEC = Math.PI / 180 / 3600;

describe('createHelmertShift', () => {
  // OSGB36 ↔ WGS 84, the EPSG:27700 fallback parameters (position vector, as PROJ +towgs84).
  const airy = { a: 6377563.396, f: 1 / 299.3249646 };
  const shift = createHelmertShift(
    {
      dx: 446.448,
      dy: -125.157,
      dz: 542.06,
      rx: 0.15 * ARCSEC,
      ry: 0.247 * ARCSEC,
      rz: 0.842 * ARCSEC,
      scale: 1 - 20.489e-6,
    },
    airy.a,
    airy.f * (2 - airy.f),
  );

  it('goes there and back to within a micrometre', () => {
    const out = new Float64Array(3);
    for (const [lat, lon] of [
      [50.5, 0.5],
      [58.2, -6.1],
      [54, -2],
    ] as const) {
      shift.toDatum(lat, lon, out);
      shift.toWgs84(out[0] as number, out[1] as number, out);
      expect(inverseGeodesic(out[0] as number, out[1] as number, lat, lon).distanceM).toBeLessThan(1e-5);
    }
  });

  it('moves a point in southern England by about 100 m (OSGB36 vs WGS 84, from memory: of that order)', () => {
    const out = new Float64Array(3);
    shift.toDatum(50.5, 0.5, out);
    const d = inverseGeodesic(out[0] as number, out[1] as number, 50.5, 0.5).distanceM;
    expect(d).toBeGreaterThan(50);
    expect(d).toBeLessThan(200);
  });
});

describe('shiftColumns', () => {
  const clarke = { a: 6378249.145, f: 1 / 293.465 };
  // A 3-parameter shift of the size datums like these have (translation only, a few hundred metres).
  const shift = createHelmertShift(
    { dx: -166, dy: -15, dz: 204, rx: 0, ry: 0, rz: 0, scale: 1 },
    clarke.a,
    clarke.f * (2 - clarke.f),
  );

  function worstMissM(lat: Float64Array, lon: Float64Array): number {
    const outLat = new Float64Array(lat.length);
    const outLon = new Float64Array(lat.length);
    shiftColumns(shift.toDatum, lat, lon, outLat, outLon);
    const exact = new Float64Array(3);
    let worst = 0;
    for (let i = 0; i < lat.length; i++) {
      shift.toDatum(lat[i] as number, lon[i] as number, exact);
      const d = inverseGeodesic(outLat[i] as number, outLon[i] as number, exact[0] as number, exact[1] as number);
      worst = Math.max(worst, d.distanceM);
    }
    return worst;
  }

  it('interpolates within 10 µm of the exact shift along tracks, in both hemispheres and across the antimeridian', () => {
    for (const [lat0, lon0] of [
      [14.6, -17.4],
      [-33.9, 18.4],
      [65.1, 179.99],
      [-79.5, -60.2],
    ] as const) {
      const n = 20_000;
      const lat = new Float64Array(n);
      const lon = new Float64Array(n);
      for (let i = 0; i < n; i++) {
        lat[i] = lat0 + 0.05 * Math.sin(i / 900);
        lon[i] = lon0 + 0.08 * Math.cos(i / 1300);
      }
      expect(worstMissM(lat, lon), `track near ${lat0}, ${lon0}`).toBeLessThan(1e-5);
    }
  });

  it('shifts scattered points and points near the poles exactly, and keeps NaN as NaN', () => {
    const lat = Float64Array.of(10, -45, 85, 89.9, Number.NaN, 10);
    const lon = Float64Array.of(20, 170, -30, 100, 5, 20);
    expect(worstMissM(lat.subarray(0, 4), lon.subarray(0, 4))).toBe(0);
    const outLat = new Float64Array(6);
    const outLon = new Float64Array(6);
    shiftColumns(shift.toDatum, lat, lon, outLat, outLon);
    expect(outLat[4]).toBeNaN();
    expect(Number.isFinite(outLat[5] as number)).toBe(true);
  });
});
