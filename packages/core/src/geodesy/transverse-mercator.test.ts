import { describe, expect, it } from 'vitest';
import { dms } from './reference-tools.test-helper.js';
import { createTransverseMercator } from './transverse-mercator.js';

const airy = { a: 6377563.396, f: 1 / 299.3249646 };
const osgb = { lat0Deg: 49, lon0Deg: -2, falseEastingM: 400000, falseNorthingM: -100000 };

describe('createTransverseMercator', () => {
  const out = new Float64Array(2);

  it('reproduces the EPSG method 9807 example (GN7-2, OSGB 1936 / BNG) with the printed k0 (check-values.md §1.1)', () => {
    // Published E 577274.99, N 69740.50 follow from the rounded k0 = 0.9996013 (check-values.md).
    const tm = createTransverseMercator({ ...airy, ...osgb, k0: 0.9996013 });
    tm.forwardPoint(50.5, 0.5, out);
    expect(Math.abs((out[0] as number) - 577274.99)).toBeLessThanOrEqual(0.005);
    expect(Math.abs((out[1] as number) - 69740.5)).toBeLessThanOrEqual(0.005);
  });

  it('reproduces the exact-k0 row (Krüger n⁶, check-values.md §1.1, C) and reverses to the input', () => {
    const tm = createTransverseMercator({ ...airy, ...osgb, k0: 0.9996012717 });
    tm.forwardPoint(50.5, 0.5, out);
    expect(Math.abs((out[0] as number) - 577274.984)).toBeLessThanOrEqual(0.0005);
    expect(Math.abs((out[1] as number) - 69740.492)).toBeLessThanOrEqual(0.0005);
    tm.inversePoint(577274.984, 69740.492, out);
    // "Reverse gives 50°30'00.000"N, 00°30'00.000"E" (EPSG method 9807 record).
    expect(Math.abs((out[0] as number) - 50.5) * 3600).toBeLessThanOrEqual(0.0005);
    expect(Math.abs((out[1] as number) - 0.5) * 3600).toBeLessThanOrEqual(0.0005);
  });

  it('reproduces the WGS 84 UTM example 33.3°N 44.4°E = 38N 444140.54 3684706.36 (GeoConvert(1) manual, check-values.md §1.3)', () => {
    const tm = createTransverseMercator({
      a: 6378137,
      f: 1 / 298.257223563,
      lat0Deg: 0,
      lon0Deg: 45,
      k0: 0.9996,
      falseEastingM: 500000,
      falseNorthingM: 0,
    });
    tm.forwardPoint(33.3, 44.4, out);
    expect(Math.abs((out[0] as number) - 444140.54)).toBeLessThanOrEqual(0.005 + 0.0005);
    expect(Math.abs((out[1] as number) - 3684706.36)).toBeLessThanOrEqual(0.005);
    // MGRS 38SMB4488 square centre 38n 444500 3688500 = 33.33424 44.40363 (GeoConvert(1) manual, EXAMPLES).
    tm.inversePoint(444500, 3688500, out);
    expect(Math.abs((out[0] as number) - 33.33424)).toBeLessThanOrEqual(0.000005);
    expect(Math.abs((out[1] as number) - 44.40363)).toBeLessThanOrEqual(0.000005);
  });

  it("reproduces Snyder's Clarke 1866 example, x 127106.5 y 4484124.4 (USGS PP 1395 p. 269, check-values.md §1.3)", () => {
    const e2 = 0.00676866;
    const f = 1 - Math.sqrt(1 - e2);
    const tm = createTransverseMercator({
      a: 6378206.4,
      f,
      lat0Deg: 0,
      lon0Deg: -75,
      k0: 0.9996,
      falseEastingM: 0,
      falseNorthingM: 0,
    });
    tm.forwardPoint(dms(40, 30, 0), dms(73, 30, 0, true), out);
    expect(Math.abs((out[0] as number) - 127106.5)).toBeLessThanOrEqual(0.05);
    expect(Math.abs((out[1] as number) - 4484124.4)).toBeLessThanOrEqual(0.05);
  });

  it('turns NaN into NaN in columns', () => {
    const tm = createTransverseMercator({ ...airy, ...osgb, k0: 1 });
    const e = new Float64Array(2);
    const n = new Float64Array(2);
    tm.forward(Float64Array.of(0.5, Number.NaN), Float64Array.of(50.5, 50), e, n);
    expect(Number.isFinite(e[0] as number)).toBe(true);
    expect(e[1]).toBeNaN();
  });
});
