import { describe, expect, it } from 'vitest';
import { inverseGeodesic } from './geodesic.js';
import { createHelmertShift } from './helmert-shift.js';

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
      expect(inverseGeodesic(out[0] as number, out[1] as number, lat, lon).distanceM).toBeLessThan(1e-6);
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
