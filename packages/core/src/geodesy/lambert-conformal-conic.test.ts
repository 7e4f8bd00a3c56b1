import { describe, expect, it } from 'vitest';
import { createLambertConformalConic } from './lambert-conformal-conic.js';

const GRS80_E2 = 0.0066943800229007;

describe('createLambertConformalConic', () => {
  // Parameters of the French Lambert-93 grid (EPSG:2154); the GN7-2 example and the PROJ cross-check
  // are in crs/create-reprojection.test.ts.
  const lcc = createLambertConformalConic({
    a: 6378137,
    e2: GRS80_E2,
    lat0Deg: 46.5,
    lon0Deg: 3,
    lat1Deg: 49,
    lat2Deg: 44,
    k0: 1,
    falseEastingM: 700000,
    falseNorthingM: 6600000,
  });

  it('puts the false origin at the false easting and northing, and the apex pole at the cone tip', () => {
    const x = new Float64Array(2);
    const y = new Float64Array(2);
    lcc.forward(Float64Array.of(3, 3), Float64Array.of(46.5, 90), x, y);
    expect(x[0]).toBeCloseTo(700000, 6);
    expect(y[0]).toBeCloseTo(6600000, 6);
    const lon = new Float64Array(2);
    const lat = new Float64Array(2);
    lcc.inverse(x, y, lon, lat);
    expect(lat[0]).toBeCloseTo(46.5, 12);
    expect(lat[1]).toBe(90);
  });

  it('gives no finite position for the far pole, and NaN for NaN', () => {
    const x = new Float64Array(2);
    const y = new Float64Array(2);
    lcc.forward(Float64Array.of(3, Number.NaN), Float64Array.of(-90, 45), x, y);
    expect(Number.isFinite(y[0] as number)).toBe(false);
    expect(x[1]).toBeNaN();
  });

  it('refuses parallels that make no cone', () => {
    const params = { a: 6378137, e2: GRS80_E2, lat0Deg: 0, lon0Deg: 0, k0: 1, falseEastingM: 0, falseNorthingM: 0 };
    expect(() => createLambertConformalConic({ ...params, lat1Deg: 0, lat2Deg: 0 })).toThrow(RangeError);
  });
});
