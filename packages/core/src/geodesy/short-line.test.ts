import { describe, expect, it } from 'vitest';
import { inverseGeodesic } from './geodesic.js';
import { seededRandom } from './reference-tools.test-helper.js';
import { shortLineDistanceAzimuth, shortLineDistanceM } from './short-line.js';

describe('shortLineDistanceM', () => {
  it('stays within 0.1 mm of GeographicLib on 20 000 random lines up to the fast-path limit and beyond', () => {
    const random = seededRandom(42);
    let worstM = 0;
    for (let i = 0; i < 20_000; i++) {
      const lat1 = random() * 178 - 89;
      const lon1 = random() * 360 - 180;
      const scale = i % 4 === 0 ? 0.05 : 0.012; // some lines beyond the 0.01° limit use GeographicLib
      const lat2 = Math.max(-90, Math.min(90, lat1 + (random() - 0.5) * scale));
      const lon2 = lon1 + (random() - 0.5) * scale;
      const exact = inverseGeodesic(lat1, lon1, lat2, lon2).distanceM;
      worstM = Math.max(worstM, Math.abs(shortLineDistanceM(lat1, lon1, lat2, lon2) - exact));
    }
    expect(worstM).toBeLessThanOrEqual(1e-4);
  });

  it('measures across the antimeridian the short way', () => {
    expect(shortLineDistanceM(10, 179.9999, 10, -179.9999)).toBeCloseTo(
      inverseGeodesic(10, 179.9999, 10, -179.9999).distanceM,
      6,
    );
  });
});

describe('shortLineDistanceAzimuth', () => {
  it('gives the mid-point azimuth within 0.001° of the mean of GeographicLib end azimuths', () => {
    const random = seededRandom(43);
    const out = new Float64Array(2);
    let worstDeg = 0;
    for (let i = 0; i < 5000; i++) {
      const lat1 = random() * 160 - 80;
      const lon1 = random() * 360 - 180;
      const lat2 = lat1 + (random() - 0.5) * 0.018;
      const lon2 = lon1 + (random() - 0.5) * 0.018;
      shortLineDistanceAzimuth(lat1, lon1, lat2, lon2, out);
      const g = inverseGeodesic(lat1, lon1, lat2, lon2);
      let mid = g.azimuth1Deg + 0.5 * (((g.azimuth2Deg - g.azimuth1Deg + 540) % 360) - 180);
      mid = ((mid % 360) + 360) % 360;
      const diff = Math.abs((((out[1] as number) - mid + 540) % 360) - 180);
      worstDeg = Math.max(worstDeg, diff);
    }
    expect(worstDeg).toBeLessThan(0.001);
  });
});
