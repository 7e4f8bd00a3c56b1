import { describe, expect, it } from 'vitest';
import { createLambertAzimuthalEqualArea } from './lambert-azimuthal-equal-area.js';

const GRS80_E2 = 0.0066943800229007;

describe('createLambertAzimuthalEqualArea', () => {
  // Parameters of ETRS89-extended / LAEA Europe (EPSG:3035); the PROJ cross-check is in crs/create-reprojection.test.ts.
  const laea = createLambertAzimuthalEqualArea({
    a: 6378137,
    e2: GRS80_E2,
    lat0Deg: 52,
    lon0Deg: 10,
    falseEastingM: 4321000,
    falseNorthingM: 3210000,
  });

  it('maps the origin to the false origin and back', () => {
    const x = new Float64Array(1);
    const y = new Float64Array(1);
    laea.forward(Float64Array.of(10), Float64Array.of(52), x, y);
    expect(x[0]).toBeCloseTo(4321000, 6);
    expect(y[0]).toBeCloseTo(3210000, 6);
    const lon = new Float64Array(1);
    const lat = new Float64Array(1);
    laea.inverse(x, y, lon, lat);
    expect([lon[0], lat[0]]).toEqual([10, 52]);
  });

  it('goes there and back to 1e-9° over Europe and beyond (the Newton polish of the series inverse)', () => {
    const n = 2000;
    const lon = new Float64Array(n);
    const lat = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      lon[i] = -40 + ((i * 37) % 100);
      lat[i] = 10 + ((i * 53) % 78);
    }
    const x = new Float64Array(n);
    const y = new Float64Array(n);
    laea.forward(lon, lat, x, y);
    const lonBack = new Float64Array(n);
    const latBack = new Float64Array(n);
    laea.inverse(x, y, lonBack, latBack);
    for (let i = 0; i < n; i++) {
      expect(Math.abs((lonBack[i] as number) - (lon[i] as number))).toBeLessThan(1e-9);
      expect(Math.abs((latBack[i] as number) - (lat[i] as number))).toBeLessThan(1e-9);
    }
  });

  it('refuses a polar origin, which needs other formulas', () => {
    expect(() =>
      createLambertAzimuthalEqualArea({ a: 1, e2: 0, lat0Deg: 90, lon0Deg: 0, falseEastingM: 0, falseNorthingM: 0 }),
    ).toThrow(RangeError);
  });
});
