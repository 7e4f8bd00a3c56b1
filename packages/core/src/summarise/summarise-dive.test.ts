import { describe, expect, it } from 'vitest';
import { directGeodesic } from '../geodesy/geodesic.js';
import { trackOf } from '../geodesy/track-fixture.test-helper.js';
import { summariseDive } from './summarise-dive.js';

const T0 = Date.UTC(2026, 5, 1, 9, 0, 0);

/** An invented descent–bottom–ascent dive off "Hollowtide Point": 11 fixes, 1 Hz. */
function exampleDive() {
  const depths = [0, 10, 20, 30, 30, 29, 30, 30, 20, 10, 0];
  return trackOf(
    depths.map((depthM, i) => {
      const p = directGeodesic(57.1, -2.0, 90, 10 * i);
      return {
        timeMs: T0 + 1000 * i,
        latDeg: p.latDeg,
        lonDeg: p.lonDeg,
        depthM,
        surfaceLatDeg: 57.1,
        surfaceLonDeg: -2.0,
      };
    }),
  );
}

describe('summariseDive', () => {
  it('names every field with its unit and computes times, distances, depths and ranges', () => {
    const s = summariseDive(exampleDive());
    expect(s.startTime).toBe('2026-06-01T09:00:00.000Z');
    expect(s.endTime).toBe('2026-06-01T09:00:10.000Z');
    expect(s.durationS).toBe(10);
    expect(s.fixCount).toBe(11);
    expect(s.positionedFixCount).toBe(11);
    expect(s.meanFixRateHz).toBeCloseTo(1, 12);
    expect(s.distanceM).toBeCloseTo(100, 4);
    // 3-D: six 10 m legs with 10 m depth change (√200 each), two with 1 m (√101), two level (10).
    expect(s.distance3dM).toBeCloseTo(6 * Math.sqrt(200) + 2 * Math.sqrt(101) + 2 * 10, 3);
    expect(s.maxDepthM).toBe(30);
    expect(s.meanDepthM).toBeCloseTo(209 / 11, 12);
    expect(s.maxHorizontalRangeM).toBeCloseTo(100, 4);
    expect(s.maxSlantRangeM).toBeCloseTo(Math.hypot(100, 0), 4);
    expect(s.surfaceSource).toBe('vehicle-columns');
    expect(s.bboxDeg?.[1]).toBeCloseTo(57.1, 6);
    expect(s.startPosition).toEqual({ latDeg: 57.1, lonDeg: -2 });
    expect(s.centroid?.lonDeg).toBeGreaterThan(-2);
    expect(s.flaggedShare).toBeNull();
  });

  it('counts time on bottom as time between consecutive fixes both in the bottom band (≥ 0.8 × max depth)', () => {
    const s = summariseDive(exampleDive());
    expect(s.bottomDepthThresholdM).toBe(24);
    // Fixes 3–7 are at ≥ 24 m: four 1 s intervals.
    expect(s.timeOnBottomS).toBe(4);
    expect(summariseDive(exampleDive(), { bottomFraction: 0.5 }).timeOnBottomS).toBe(6);
  });

  it('reports the flagged share when flags are given and refuses flags of the wrong length', () => {
    const flagged = new Uint8Array(11);
    flagged[2] = 1;
    flagged[5] = 1;
    const s = summariseDive(exampleDive(), { flagged });
    expect(s.flaggedFixCount).toBe(2);
    expect(s.flaggedShare).toBeCloseTo(2 / 11, 12);
    expect(() => summariseDive(exampleDive(), { flagged: new Uint8Array(3) })).toThrow(RangeError);
  });

  it('summarises an empty track with nulls and zeros, never NaN', () => {
    const s = summariseDive(trackOf([]));
    expect(JSON.stringify(s)).not.toMatch(/NaN/);
    expect(s.durationS).toBeNull();
    expect(s.distanceM).toBe(0);
    expect(s.bboxDeg).toBeNull();
    expect(s.timeOnBottomS).toBeNull();
  });

  it('gives an antimeridian-aware box', () => {
    const s = summariseDive(
      trackOf([
        { timeMs: T0, latDeg: -17, lonDeg: 179.99 },
        { timeMs: T0 + 1000, latDeg: -17.01, lonDeg: -179.99 },
      ]),
    );
    expect(s.bboxDeg?.[0]).toBeCloseTo(179.99, 9);
    expect(s.bboxDeg?.[2]).toBeCloseTo(-179.99, 9);
  });
});
