import { describe, expect, it } from 'vitest';
import { directGeodesic, inverseGeodesic } from './geodesic.js';
import {
  computeBoundingBox,
  computeCentroid,
  computeSegmentDistances,
  computeSpeedAndCourse,
  measureTrackLength,
} from './measure-track.js';
import { trackOf } from './track-fixture.test-helper.js';

const T0 = Date.UTC(2026, 5, 1, 9, 0, 0);

describe('measureTrackLength', () => {
  it('sums geodesic segment lengths and adds depth change in 3-D', () => {
    const a = { latDeg: 59.9, lonDeg: 10.7 };
    const b = directGeodesic(a.latDeg, a.lonDeg, 45, 30);
    const c = directGeodesic(b.latDeg, b.lonDeg, 135, 40);
    const track = trackOf([
      { timeMs: T0, ...a, depthM: 10 },
      { timeMs: T0 + 1000, latDeg: b.latDeg, lonDeg: b.lonDeg, depthM: 10 },
      { timeMs: T0 + 2000, latDeg: c.latDeg, lonDeg: c.lonDeg, depthM: 40 },
    ]);
    const r = measureTrackLength(track);
    expect(r.distanceM).toBeCloseTo(70, 6);
    expect(r.distance3dM).toBeCloseTo(30 + 50, 6); // √(40² + 30²) = 50
    expect(r.pairCount).toBe(2);
  });

  it('skips fixes without a position and can leave out the line across a segment gap', () => {
    const track = trackOf(
      [
        { timeMs: T0, latDeg: 0, lonDeg: 0 },
        { timeMs: T0 + 1, latDeg: Number.NaN, lonDeg: Number.NaN },
        { timeMs: T0 + 2, latDeg: 0, lonDeg: 0.001 },
        { timeMs: T0 + 3, latDeg: 0, lonDeg: 0.002 },
      ],
      { breaks: [3] },
    );
    const oneDegree = inverseGeodesic(0, 0, 0, 0.001).distanceM;
    expect(measureTrackLength(track).distanceM).toBeCloseTo(2 * oneDegree, 6);
    expect(measureTrackLength(track, { acrossSegments: false }).distanceM).toBeCloseTo(oneDegree, 6);
  });

  it('measures a track across the antimeridian correctly (not the long way round)', () => {
    const track = trackOf([
      { timeMs: T0, latDeg: -17, lonDeg: 179.999 },
      { timeMs: T0 + 1000, latDeg: -17, lonDeg: -179.999 },
    ]);
    expect(measureTrackLength(track).distanceM).toBeCloseTo(inverseGeodesic(-17, 179.999, -17, -179.999).distanceM, 6);
    expect(measureTrackLength(track).distanceM).toBeLessThan(250);
  });
});

describe('computeSegmentDistances', () => {
  it('gives NaN for the first fix and the distance from the previous positioned fix otherwise', () => {
    const d = computeSegmentDistances(
      trackOf([
        { timeMs: T0, latDeg: 0, lonDeg: 0 },
        { timeMs: T0 + 1, latDeg: 0, lonDeg: 0.0001 },
      ]),
    );
    expect(d[0]).toBeNaN();
    expect(d[1]).toBeCloseTo(inverseGeodesic(0, 0, 0, 0.0001).distanceM, 6);
  });
});

describe('computeSpeedAndCourse', () => {
  it('gives speed over ground in m/s and course in degrees true', () => {
    const p = directGeodesic(45, -63, 90, 10);
    const track = trackOf([
      { timeMs: T0, latDeg: 45, lonDeg: -63 },
      { timeMs: T0 + 4000, latDeg: p.latDeg, lonDeg: p.lonDeg },
      { timeMs: T0 + 4000, latDeg: 45, lonDeg: -63 },
    ]);
    const r = computeSpeedAndCourse(track);
    expect(r.speedMps[0]).toBeNaN();
    expect(r.speedMps[1]).toBeCloseTo(2.5, 6);
    expect(r.courseDeg[1]).toBeCloseTo(90, 3);
    expect(r.speedMps[2]).toBeNaN(); // time did not increase
    expect(r.courseDeg[2]).toBeCloseTo(270, 3);
  });
});

describe('computeBoundingBox', () => {
  it('gives west > east for points across the antimeridian (RFC 7946 §5.2 example shape)', () => {
    expect(computeBoundingBox([-20, -16, -18], [177, -178, 179])).toEqual({
      west: 177,
      south: -20,
      east: -178,
      north: -16,
    });
  });

  it('gives an ordinary box otherwise and undefined without positions', () => {
    expect(computeBoundingBox([1, 2], [3, 4])).toEqual({ west: 3, south: 1, east: 4, north: 2 });
    expect(computeBoundingBox([Number.NaN], [1])).toBeUndefined();
  });

  it('agrees with the largest-gap rule worked out by sorting, for narrow and wide spreads of longitude', () => {
    // The rule itself (the box is the complement of the largest gap between sorted longitudes),
    // written plainly here; computeBoundingBox skips the sort when the spread is under 180°.
    const byGap = (lons: number[]) => {
      const s = [...lons].sort((a, b) => a - b);
      let best = { gap: (s[0] as number) + 360 - (s[s.length - 1] as number), west: s[0], east: s[s.length - 1] };
      for (let i = 1; i < s.length; i++) {
        const g = (s[i] as number) - (s[i - 1] as number);
        if (g > best.gap) best = { gap: g, west: s[i], east: s[i - 1] };
      }
      return { west: best.west, east: best.east };
    };
    let x = 7;
    const next = () => {
      x = (x * 1_103_515_245 + 12_345) % 2_147_483_648;
      return x / 2_147_483_648;
    };
    for (let k = 0; k < 200; k++) {
      const centre = next() * 360 - 180;
      const spread = [1, 90, 179.9, 180, 200, 359][k % 6] as number;
      const lons = Array.from({ length: 1 + (k % 13) }, () => {
        const lon = centre + (next() - 0.5) * spread;
        return lon >= 180 ? lon - 360 : lon < -180 ? lon + 360 : lon;
      });
      const lats = lons.map(() => next() * 10);
      const box = computeBoundingBox(lats, lons);
      expect({ west: box?.west, east: box?.east }).toEqual(byGap(lons));
    }
  });
});

describe('computeCentroid', () => {
  it('averages across the antimeridian without jumping to longitude 0', () => {
    const c = computeCentroid([0, 0], [179, -179]);
    expect(Math.abs(c?.lonDeg ?? 0)).toBeCloseTo(180, 6);
    expect(c?.latDeg).toBeCloseTo(0, 9);
    expect(computeCentroid([], [])).toBeUndefined();
  });
});
