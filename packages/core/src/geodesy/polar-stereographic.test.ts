import { describe, expect, it } from 'vitest';
import { createPolarStereographic } from './polar-stereographic.js';

const WGS84_E2 = 0.0066943799901413165;

describe('createPolarStereographic', () => {
  it('maps the pole to the false origin and back, north and south', () => {
    for (const pole of ['north', 'south'] as const) {
      const ps = createPolarStereographic({
        a: 6378137,
        e2: WGS84_E2,
        pole,
        lon0Deg: 0,
        k0: 0.994,
        falseEastingM: 2000000,
        falseNorthingM: 2000000,
      });
      const x = new Float64Array(1);
      const y = new Float64Array(1);
      ps.forward(Float64Array.of(30), Float64Array.of(pole === 'north' ? 90 : -90), x, y);
      expect([x[0], y[0]]).toEqual([2000000, 2000000]);
      const lon = new Float64Array(1);
      const lat = new Float64Array(1);
      ps.inverse(x, y, lon, lat);
      expect(lat[0]).toBe(pole === 'north' ? 90 : -90);
    }
  });

  it('has scale 1 on the standard parallel of variant B (EPSG 9829: k = 1 at φF by definition)', () => {
    // The scale along the meridian from a finite difference of northings against the meridian arc.
    const ps = createPolarStereographic({
      a: 6378137,
      e2: WGS84_E2,
      pole: 'south',
      lon0Deg: 0,
      k0: 1,
      latTsDeg: -71,
      falseEastingM: 0,
      falseNorthingM: 0,
    });
    const x = new Float64Array(2);
    const y = new Float64Array(2);
    const dLatDeg = 1e-5;
    ps.forward(Float64Array.of(0, 0), Float64Array.of(-71 - dLatDeg / 2, -71 + dLatDeg / 2), x, y);
    const phi = (-71 * Math.PI) / 180;
    const s = Math.sin(phi);
    const meridianRadiusM = (6378137 * (1 - WGS84_E2)) / (1 - WGS84_E2 * s * s) ** 1.5;
    const arcM = meridianRadiusM * ((dLatDeg * Math.PI) / 180);
    expect(Math.abs((y[1] as number) - (y[0] as number)) / arcM).toBeCloseTo(1, 8);
  });
});
