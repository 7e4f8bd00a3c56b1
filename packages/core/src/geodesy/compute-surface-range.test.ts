import { describe, expect, it } from 'vitest';
import { computeSurfaceRange } from './compute-surface-range.js';
import { directGeodesic, inverseGeodesic } from './geodesic.js';
import { trackOf } from './track-fixture.test-helper.js';

const T0 = Date.UTC(2026, 5, 1, 9, 0, 0);

describe('computeSurfaceRange', () => {
  it('uses the surface position logged beside each fix: horizontal range, slant range, bearing', () => {
    const v = directGeodesic(50, -4, 30, 300);
    const track = trackOf([
      { timeMs: T0, latDeg: v.latDeg, lonDeg: v.lonDeg, depthM: 400, surfaceLatDeg: 50, surfaceLonDeg: -4 },
    ]);
    const r = computeSurfaceRange(track);
    expect(r.surfaceSource).toBe('vehicle-columns');
    expect(r.horizontalRangeM[0]).toBeCloseTo(300, 4);
    expect(r.slantRangeM[0]).toBeCloseTo(500, 4);
    expect(r.bearingDeg[0]).toBeCloseTo(30, 2);
  });

  it('interpolates a separate surface track in time, never extrapolating or bridging long gaps', () => {
    const vehicle = trackOf([
      { timeMs: T0 + 500, latDeg: 50.001, lonDeg: -4, depthM: 0 },
      { timeMs: T0 + 60_000, latDeg: 50.001, lonDeg: -4, depthM: 0 },
      { timeMs: T0 - 1000, latDeg: 50.001, lonDeg: -4, depthM: 0 },
    ]);
    const surface = trackOf(
      [
        { timeMs: T0, latDeg: 50, lonDeg: -4 },
        { timeMs: T0 + 1000, latDeg: 50.001, lonDeg: -4 },
        { timeMs: T0 + 100_000, latDeg: 50.001, lonDeg: -4 },
      ],
      { role: 'surface' },
    );
    const r = computeSurfaceRange(vehicle, { surface });
    expect(r.surfaceSource).toBe('surface-track');
    // Half-way between the two surface fixes: 50.0005°N, 0.0005° of latitude south of the vehicle.
    expect(r.horizontalRangeM[0]).toBeCloseTo(inverseGeodesic(50.0005, -4, 50.001, -4).distanceM, 3);
    expect(r.horizontalRangeM[1]).toBeNaN(); // gap of 99 s between surface fixes
    expect(r.horizontalRangeM[2]).toBeNaN(); // before the surface track starts
  });

  it('says when no surface position is known', () => {
    const r = computeSurfaceRange(trackOf([{ timeMs: T0, latDeg: 1, lonDeg: 1 }]));
    expect(r.surfaceSource).toBe('none');
    expect(r.horizontalRangeM[0]).toBeNaN();
  });
});
