import { describe, expect, it } from 'vitest';
import { createLocalFrame } from '../geodesy/create-local-frame.js';
import { createTangentPlane } from './create-tangent-plane.js';

describe('createTangentPlane', () => {
  for (const [lat, lon] of [
    [63.4412, 8.6931],
    [-42.88, 147.33],
    [56.5, -5.6],
    [0.5, 179.999],
  ] as const) {
    it(`matches the geodesy module's local frame near ${lat}, ${lon} (1 cm at 2 km, 0.5 m at 10 km) and round-trips`, () => {
      const frame = createLocalFrame(lat, lon);
      const plane = createTangentPlane(lat, lon);
      const out = new Float64Array(2);
      for (const [e, n, tolerance] of [
        [1500, -1200, 0.01],
        [-800, 1900, 0.01],
        [7000, 7000, 0.5],
        [-9000, -3000, 0.5],
      ] as const) {
        const p = frame.inverse(e, n);
        const east = new Float64Array(1);
        const north = new Float64Array(1);
        plane.forwardColumns(Float64Array.of(p.latDeg), Float64Array.of(p.lonDeg), east, north);
        expect(Math.hypot((east[0] as number) - e, (north[0] as number) - n)).toBeLessThan(tolerance);
        plane.inverseInto(east[0] as number, north[0] as number, out);
        expect(out[0]).toBeCloseTo(p.latDeg, 10);
        expect(out[1]).toBeCloseTo(p.lonDeg, 10);
      }
    });
  }
});
