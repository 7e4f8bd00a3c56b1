import { describe, expect, it } from 'vitest';
import { createConformalLatitude } from './conformal-latitude.js';

describe('createConformalLatitude', () => {
  it('inverts itself and is the identity on a sphere', () => {
    const wgs84 = createConformalLatitude(0.0066943799901413165);
    for (const latDeg of [-89.9, -45, 0, 12.5, 60, 89.99]) {
      const tau = Math.tan((latDeg * Math.PI) / 180);
      const back = wgs84.geodeticTan(wgs84.conformalTan(tau));
      expect(Math.abs(back - tau)).toBeLessThanOrEqual(1e-12 * Math.max(1, Math.abs(tau)));
    }
    expect(createConformalLatitude(0).conformalTan(0.7)).toBe(0.7);
  });

  it('makes the conformal latitude smaller in size than the geodetic one away from the equator and poles', () => {
    const wgs84 = createConformalLatitude(0.0066943799901413165);
    // At 45° the difference is about 0.19° (Snyder, PP 1395, table 3: 44.8077°, from memory).
    const chi = (Math.atan(wgs84.conformalTan(1)) * 180) / Math.PI;
    expect(chi).toBeLessThan(45);
    expect(chi).toBeGreaterThan(44.7);
  });

  it('gives the same geodetic latitude by its series as by Newton, to 1e-14 rad, on WGS 84, Clarke 1866 and a flat test ellipsoid', () => {
    // Own cross-check: the series coefficients are derived from Newton's values, so this guards the derivation.
    for (const e2 of [0.0066943799901413165, 0.006768657997291094, 0.05]) {
      const conformal = createConformalLatitude(e2);
      for (let latDeg = -89.95; latDeg < 90; latDeg += 0.37) {
        const tauPrime = conformal.conformalTan(Math.tan((latDeg * Math.PI) / 180));
        const newton = Math.atan(conformal.geodeticTan(tauPrime));
        expect(Math.abs(conformal.geodeticLatitude(tauPrime) - newton)).toBeLessThan(1e-14);
      }
    }
  });
});
