import { describe, expect, it } from 'vitest';
import { createLocalFrame } from './create-local-frame.js';
import { directGeodesic, inverseGeodesic } from './geodesic.js';

describe('createLocalFrame', () => {
  it('puts the origin at (0, 0) and a point 1 km due east at about (1000, 0)', () => {
    const frame = createLocalFrame(59.3, 10.5);
    expect(frame.forward(59.3, 10.5)).toEqual({ eastM: 0, northM: 0 });
    const east = directGeodesic(59.3, 10.5, 90, 1000);
    const p = frame.forward(east.latDeg, east.lonDeg);
    expect(p.eastM).toBeCloseTo(1000, 2);
    expect(Math.abs(p.northM)).toBeLessThan(0.01);
  });

  it('keeps distances from the origin within 1.3 ppm out to 10 km (its documented scale error)', () => {
    const frame = createLocalFrame(-33.9, 151.3);
    for (const azimuth of [0, 37, 90, 145, 200, 270, 333]) {
      const p = directGeodesic(-33.9, 151.3, azimuth, 10_000);
      const local = frame.forward(p.latDeg, p.lonDeg);
      expect(Math.abs(Math.hypot(local.eastM, local.northM) - 10_000)).toBeLessThan(10_000 * 1.3e-6);
    }
  });

  it('inverts forward to a millimetre and works across the antimeridian', () => {
    const frame = createLocalFrame(-17, 179.99);
    const local = frame.forward(-17.001, -179.995);
    expect(local.eastM).toBeGreaterThan(1000);
    const back = frame.inverse(local.eastM, local.northM);
    expect(inverseGeodesic(back.latDeg, back.lonDeg, -17.001, -179.995).distanceM).toBeLessThan(0.001);
  });

  it('maps columns and NaN', () => {
    const frame = createLocalFrame(0, 0);
    const r = frame.forwardColumns(Float64Array.of(0, Number.NaN), Float64Array.of(0, 1));
    expect(r.eastM[0]).toBe(0);
    expect(r.northM[1]).toBeNaN();
    expect(frame.forward(Number.NaN, 0).eastM).toBeNaN();
    expect(() => createLocalFrame(Number.NaN, 0)).toThrow(RangeError);
  });
});
