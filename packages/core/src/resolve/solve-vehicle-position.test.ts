import { describe, expect, it } from 'vitest';
import { inverseGeodesic } from '../geodesy/geodesic.js';
import { solveVehiclePosition, type VehiclePositionInput } from './solve-vehicle-position.js';

const base: VehiclePositionInput = {
  surfaceLatDeg: 60,
  surfaceLonDeg: 5,
  surfaceHeadingTrueDeg: 0,
  leverArmForwardM: 0,
  leverArmStarboardM: 0,
  transceiverDepthM: 0,
  slantRangeM: 50,
  azimuthDeg: 90,
  vehicleDepthM: 30,
};

function solved(input: VehiclePositionInput) {
  const result = solveVehiclePosition(input);
  if (!result.ok) throw new Error(`expected a position, got ${result.reason}`);
  return result;
}

describe('solveVehiclePosition', () => {
  it('puts a vehicle straight below the transceiver at the transceiver', () => {
    const r = solved({ ...base, transceiverDepthM: 2, vehicleDepthM: 42, slantRangeM: 40 });
    expect(r.horizontalRangeM).toBe(0);
    expect(r.latDeg).toBe(60);
    expect(r.lonDeg).toBe(5);
  });

  it('uses the 3-4-5 triangle and the geodesic direct problem', () => {
    // Slant 50 m, vertical 30 m → horizontal 40 m (Pythagoras). Expected position from GeographicLib
    // `GeodSolve -p 12` with input "60 5 90 40": 59.999999998054953 5.000716845857908.
    const r = solved(base);
    expect(r.horizontalRangeM).toBeCloseTo(40, 12);
    expect(r.latDeg).toBeCloseTo(59.999999998054953, 12);
    expect(r.lonDeg).toBeCloseTo(5.000716845857908, 12);
  });

  it('turns the lever arm with the heading', () => {
    const heading = (surfaceHeadingTrueDeg: number, forwardM: number, starboardM: number) => {
      const r = solved({
        ...base,
        surfaceHeadingTrueDeg,
        leverArmForwardM: forwardM,
        leverArmStarboardM: starboardM,
        slantRangeM: 10,
        vehicleDepthM: 10,
      });
      return inverseGeodesic(60, 5, r.transceiverLatDeg, r.transceiverLonDeg);
    };
    // Heading east, 10 m forward → 10 m east of the antenna.
    const east = heading(90, 10, 0);
    expect(east.distanceM).toBeCloseTo(10, 6);
    expect(east.azimuth1Deg).toBeCloseTo(90, 6);
    // Heading north, 5 m to starboard → 5 m east; heading east, 5 m to starboard → 5 m south.
    expect(heading(0, 0, 5).azimuth1Deg).toBeCloseTo(90, 6);
    expect(heading(90, 0, 5).azimuth1Deg).toBeCloseTo(180, 6);
    // Heading 225° (south-west), 5 m forward → 5 m towards 225°.
    expect(heading(225, 5, 0).azimuth1Deg).toBeCloseTo(225, 6);
  });

  it('combines lever arm, vertical separation and azimuth as two geodesic steps', () => {
    // Antenna (−33.85, 151.2), true heading 30°, lever arm 3 m forward and 4 m starboard: the
    // transceiver is 5 m away towards 83.13010235415598° (rotation by hand). GeographicLib
    // `GeodSolve -p 12`: "-33.85 151.2 83.13010235415598 5" → -33.849994608012686 151.200053638789711,
    // then "… 200 123.456" → -33.851040505271300 151.199597383947946.
    const r = solved({
      ...base,
      surfaceLatDeg: -33.85,
      surfaceLonDeg: 151.2,
      surfaceHeadingTrueDeg: 30,
      leverArmForwardM: 3,
      leverArmStarboardM: 4,
      transceiverDepthM: 2,
      vehicleDepthM: 32,
      slantRangeM: Math.hypot(123.456, 30),
      azimuthDeg: 200,
    });
    expect(r.transceiverLatDeg).toBeCloseTo(-33.849994608012686, 11);
    expect(r.transceiverLonDeg).toBeCloseTo(151.20005363878971, 11);
    expect(r.latDeg).toBeCloseTo(-33.8510405052713, 11);
    expect(r.lonDeg).toBeCloseTo(151.19959738394795, 11);
  });

  it('moves a fix at the transceiver depth by 1 % of its range for a 1 % range error', () => {
    const input = { ...base, vehicleDepthM: 0, slantRangeM: 200 };
    const a = solved(input);
    const b = solved({ ...input, slantRangeM: 202 });
    expect(inverseGeodesic(a.latDeg, a.lonDeg, b.latDeg, b.lonDeg).distanceM).toBeCloseTo(2, 6);
  });

  it('amplifies a range error by slant/horizontal when the vehicle is deep', () => {
    // h = √(s² − v²); with s = 50, v = 30 → h = 40; with s = 50.5 → h = √(2550.25 − 900) = 40.62327…
    const a = solved(base);
    const b = solved({ ...base, slantRangeM: 50.5 });
    expect(b.horizontalRangeM - a.horizontalRangeM).toBeCloseTo(Math.sqrt(50.5 ** 2 - 900) - 40, 9);
    expect(b.horizontalRangeM - a.horizontalRangeM).toBeGreaterThan(0.5 * (50 / 40) * 0.99);
  });

  it('rejects a fix whose vertical separation exceeds its slant range instead of clamping', () => {
    const r = solveVehiclePosition({ ...base, slantRangeM: 29.9 });
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.reason).toBe('vertical-separation-exceeds-slant-range');
      expect(r.message).toContain('30.000');
    }
  });

  it('names the missing observation', () => {
    const reason = (patch: Partial<VehiclePositionInput>) => {
      const r = solveVehiclePosition({ ...base, ...patch });
      return r.ok ? 'ok' : r.reason;
    };
    expect(reason({ slantRangeM: Number.NaN })).toBe('missing-slant-range');
    expect(reason({ slantRangeM: -1 })).toBe('invalid-slant-range');
    expect(reason({ azimuthDeg: Number.NaN })).toBe('missing-bearing');
    expect(reason({ vehicleDepthM: Number.NaN })).toBe('missing-vehicle-depth');
    expect(reason({ surfaceLonDeg: Number.NaN })).toBe('missing-surface-position');
    expect(reason({ surfaceHeadingTrueDeg: Number.NaN, leverArmForwardM: 1 })).toBe('missing-surface-heading');
    // No lever arm: a missing heading does not matter for an azimuth already given.
    expect(reason({ surfaceHeadingTrueDeg: Number.NaN })).toBe('ok');
  });
});
