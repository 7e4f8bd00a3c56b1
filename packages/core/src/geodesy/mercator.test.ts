import { describe, expect, it } from 'vitest';
import { createMercator } from './mercator.js';

describe('createMercator', () => {
  const wgs84 = { a: 6378137, e2: 0.0066943799901413165, lon0Deg: 0, k0: 1, falseEastingM: 0, falseNorthingM: 0 };

  it('reproduces Mercator variant A, Makassar / NEIEZ (EPSG 9804 record and GeoAPI, check-values.md §1.1)', () => {
    const f = 1 / 299.1528128;
    const m = createMercator({
      a: 6377397.155,
      e2: f * (2 - f),
      lon0Deg: 110,
      k0: 0.997,
      falseEastingM: 3900000,
      falseNorthingM: 900000,
    });
    const x = new Float64Array(1);
    const y = new Float64Array(1);
    m.forward(Float64Array.of(120), Float64Array.of(-3), x, y);
    expect(Math.abs((x[0] as number) - 5009726.58)).toBeLessThanOrEqual(0.005);
    expect(Math.abs((y[0] as number) - 569150.82)).toBeLessThanOrEqual(0.005);
  });

  it('inverts its forward to 1e-9° and gives infinite northings at the poles', () => {
    const m = createMercator(wgs84);
    const lon = Float64Array.of(-179.5, 0, 33.3, 179.9, 0);
    const lat = Float64Array.of(-80, 0, 45.123456, 84, 90);
    const x = new Float64Array(5);
    const y = new Float64Array(5);
    m.forward(lon, lat, x, y);
    expect(y[4]).toBe(Number.POSITIVE_INFINITY);
    const lon2 = new Float64Array(5);
    const lat2 = new Float64Array(5);
    m.inverse(x, y, lon2, lat2);
    for (let i = 0; i < 4; i++) {
      expect(Math.abs((lon2[i] as number) - (lon[i] as number))).toBeLessThan(1e-9);
      expect(Math.abs((lat2[i] as number) - (lat[i] as number))).toBeLessThan(1e-9);
    }
  });
});
