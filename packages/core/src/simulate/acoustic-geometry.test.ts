import { execFileSync } from 'node:child_process';
import { describe, expect, it } from 'vitest';
import { directGeodesic, inverseGeodesic } from '../geodesy/geodesic.js';
import { type AcousticSetup, locateTransceiver, observeVehicle, solveTopsideFix } from './acoustic-geometry.js';

const SETUP: AcousticSetup = {
  soundSpeedMps: 1478.2,
  declinationDeg: 2.8,
  installationOffsetDeg: -1.3,
  leverArm: { forwardM: -4.2, starboardM: 1.1, downM: 3.6 },
  draftM: 2.1,
};
const ANTENNA = { latDeg: 59.0512, lonDeg: 5.4378 };

function vehicleAt(azimuthDeg: number, distanceM: number) {
  return directGeodesic(ANTENNA.latDeg, ANTENNA.lonDeg, azimuthDeg, distanceM);
}

describe('locateTransceiver', () => {
  it('puts a forward lever arm along the heading and a starboard one 90° to its right', () => {
    const forward = locateTransceiver(ANTENNA.latDeg, ANTENNA.lonDeg, 90, { forwardM: 10, starboardM: 0, downM: 0 });
    const a = inverseGeodesic(ANTENNA.latDeg, ANTENNA.lonDeg, forward.latDeg, forward.lonDeg);
    expect(a.distanceM).toBeCloseTo(10, 6);
    expect(a.azimuth1Deg).toBeCloseTo(90, 6);
    const starboard = locateTransceiver(ANTENNA.latDeg, ANTENNA.lonDeg, 90, { forwardM: 0, starboardM: 6, downM: 0 });
    const b = inverseGeodesic(ANTENNA.latDeg, ANTENNA.lonDeg, starboard.latDeg, starboard.lonDeg);
    expect(b.distanceM).toBeCloseTo(6, 6);
    expect(b.azimuth1Deg).toBeCloseTo(180, 6);
  });

  it('leaves the antenna position when the lever arm is zero', () => {
    expect(locateTransceiver(1, 2, 33, { forwardM: 0, starboardM: 0, downM: 5 })).toEqual({ latDeg: 1, lonDeg: 2 });
  });
});

describe('observeVehicle', () => {
  it('gives slant range² = horizontal² + vertical², the horizontal distance checked with GeographicLib GeodSolve', () => {
    const vehicle = vehicleAt(63, 140);
    const depthM = 31.5;
    const o = observeVehicle(ANTENNA.latDeg, ANTENNA.lonDeg, 205, vehicle.latDeg, vehicle.lonDeg, depthM, SETUP, 1500);
    // Reference: GeographicLib's own command-line solver (GeodSolve -i), not Leadline's binding.
    const geodSolve = execFileSync('GeodSolve', ['-i', '-p', '9'], {
      input: `${o.transceiverLatDeg} ${o.transceiverLonDeg} ${vehicle.latDeg} ${vehicle.lonDeg}\n`,
      encoding: 'utf8',
    })
      .trim()
      .split(/\s+/)
      .map(Number);
    const horizontalM = geodSolve[2] as number;
    expect(o.horizontalRangeM).toBeCloseTo(horizontalM, 6);
    expect(o.trueSlantRangeM ** 2).toBeCloseTo(horizontalM ** 2 + (depthM - SETUP.draftM) ** 2, 6);
    expect(o.trueAzimuthDeg).toBeCloseTo(((geodSolve[0] as number) + 360) % 360, 6);
  });

  it('logs the slant range scaled by assumed over water sound speed: a 1 % faster assumed speed gives 1 % longer ranges', () => {
    const vehicle = vehicleAt(200, 75);
    const exact = observeVehicle(
      ANTENNA.latDeg,
      ANTENNA.lonDeg,
      10,
      vehicle.latDeg,
      vehicle.lonDeg,
      20,
      SETUP,
      SETUP.soundSpeedMps,
    );
    const fast = observeVehicle(
      ANTENNA.latDeg,
      ANTENNA.lonDeg,
      10,
      vehicle.latDeg,
      vehicle.lonDeg,
      20,
      SETUP,
      SETUP.soundSpeedMps * 1.01,
    );
    expect(exact.loggedSlantRangeM).toBeCloseTo(exact.trueSlantRangeM, 9);
    expect(fast.loggedSlantRangeM / exact.trueSlantRangeM).toBeCloseTo(1.01, 12);
  });

  it('logs compass heading = true heading − declination − installation offset, and the bearing relative to the true heading', () => {
    const noLever: AcousticSetup = { ...SETUP, leverArm: { forwardM: 0, starboardM: 0, downM: 0 } };
    const vehicle = vehicleAt(90, 50); // due east of the transceiver
    const o = observeVehicle(ANTENNA.latDeg, ANTENNA.lonDeg, 30, vehicle.latDeg, vehicle.lonDeg, 10, noLever, 1500);
    expect(o.compassHeadingDeg).toBeCloseTo(30 - 2.8 + 1.3, 9);
    expect(o.relativeBearingDeg).toBeCloseTo(60, 6);
    // The stated identity: true azimuth = logged heading + installation offset + declination + relative bearing.
    expect(
      o.compassHeadingDeg + noLever.installationOffsetDeg + noLever.declinationDeg + o.relativeBearingDeg,
    ).toBeCloseTo(o.trueAzimuthDeg, 6);
  });
});

describe('solveTopsideFix', () => {
  it('recovers the true vehicle position from a noise-free observation when the logged setup equals the true one', () => {
    for (const [azimuth, distance, depth, heading] of [
      [63, 140, 31.5, 205],
      [301, 12, 8, 0],
      [180, 420, 55, 359.5],
    ] as const) {
      const vehicle = vehicleAt(azimuth, distance);
      const o = observeVehicle(
        ANTENNA.latDeg,
        ANTENNA.lonDeg,
        heading,
        vehicle.latDeg,
        vehicle.lonDeg,
        depth,
        SETUP,
        SETUP.soundSpeedMps,
      );
      const fix = solveTopsideFix(
        ANTENNA.latDeg,
        ANTENNA.lonDeg,
        o.compassHeadingDeg,
        o.loggedSlantRangeM,
        o.relativeBearingDeg,
        depth,
        SETUP,
      );
      expect(inverseGeodesic(fix.latDeg, fix.lonDeg, vehicle.latDeg, vehicle.lonDeg).distanceM).toBeLessThan(1e-6);
    }
  });

  it('misplaces the vehicle by 2·h·sin(Δ/2) around the transceiver when the declination is wrong by Δ', () => {
    const noLever: AcousticSetup = { ...SETUP, leverArm: { forwardM: 0, starboardM: 0, downM: 0 } };
    const vehicle = vehicleAt(120, 200);
    const o = observeVehicle(
      ANTENNA.latDeg,
      ANTENNA.lonDeg,
      75,
      vehicle.latDeg,
      vehicle.lonDeg,
      30,
      noLever,
      noLever.soundSpeedMps,
    );
    const wrong = { ...noLever, declinationDeg: 0 };
    const fix = solveTopsideFix(
      ANTENNA.latDeg,
      ANTENNA.lonDeg,
      o.compassHeadingDeg,
      o.loggedSlantRangeM,
      o.relativeBearingDeg,
      30,
      wrong,
    );
    const errorM = inverseGeodesic(fix.latDeg, fix.lonDeg, vehicle.latDeg, vehicle.lonDeg).distanceM;
    const delta = (2.8 * Math.PI) / 180;
    expect(errorM).toBeCloseTo(2 * o.horizontalRangeM * Math.sin(delta / 2), 3);
  });

  it('clamps the horizontal range to 0 and says so when the slant range is shorter than the depth difference', () => {
    const fix = solveTopsideFix(ANTENNA.latDeg, ANTENNA.lonDeg, 0, 5, 90, 20, SETUP);
    expect(fix.rangeShorterThanDepth).toBe(true);
    expect(fix.horizontalRangeM).toBe(0);
  });
});
