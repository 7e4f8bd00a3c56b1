import { describe, expect, it } from 'vitest';
import { inverseGeodesic } from '../geodesy/geodesic.js';
import { soundSpeedMackenzie1981 } from '../resolve/sound-speed.js';
import { type DiveSpec, simulateDive } from './simulate-dive.js';
import { VEHICLE_PLATFORMS } from './vehicle-platforms.js';

const QUIET_NOISE = {
  rangeFraction: 0,
  rangeFloorM: 0,
  bearingSigmaDeg: 0,
  compassSigmaDeg: 0,
  gnssSigmaM: 0,
  depthSigmaM: 0,
  vehicleHeadingSigmaDeg: 0,
};
const NO_FAULTS = {
  multipathRate: 0,
  multipathRangeErrorM: [3, 25] as const,
  multipathBearingErrorDeg: 15,
  dropoutsPerHour: 0,
  dropoutDurationS: [5, 45] as const,
  timeGlitchesPerHour: 0,
  driftEpisodesPerHour: 0,
  driftSpeedMps: [0.1, 0.35] as const,
  driftDurationS: [60, 180] as const,
};
const TRUE_SETUP = {
  declinationDeg: 2.77,
  installationOffsetDeg: -1.4,
  leverArm: { forwardM: -4.2, starboardM: 1.1, downM: 3.6 },
  draftM: 2.1,
};

/** A short boat dive circling a pen, with everything switched off unless a test turns it on. */
function cleanSpec(overrides: Partial<DiveSpec> = {}): DiveSpec {
  const water = { temperatureC: 7.5, salinityPsu: 33.8 };
  return {
    diveId: 'TEST-1',
    seed: 11,
    site: {
      id: 'test',
      name: 'Test site',
      originLatDeg: 59.0512,
      originLonDeg: 5.4378,
      timeZone: 'Europe/Oslo',
      crs: 'EPSG:25832',
    },
    startTimeMs: Date.UTC(2026, 2, 14, 9, 0, 0),
    sampleIntervalS: 1,
    flight: {
      platform: VEHICLE_PLATFORMS['inspection-rov'],
      launch: { eastM: -3, northM: -6, depthM: 0.3 },
      pattern: {
        kind: 'circles',
        centreEastM: 42,
        centreNorthM: 30,
        radiusM: 27.5,
        topDepthM: 3,
        bottomDepthM: 18,
        laps: 2,
        clockwise: true,
      },
      speedMps: 0.8,
      durationS: 900,
    },
    surfaceUnit: {
      kind: 'boat',
      name: 'Test boat',
      eastM: 0,
      northM: 0,
      headingDeg: 205,
      wanderSigmaM: 1.5,
      headingWanderSigmaDeg: 3,
    },
    water,
    trueSetup: TRUE_SETUP,
    // Filled in by the test from the simulated water when it wants the setups equal.
    loggedSetup: { ...TRUE_SETUP, soundSpeedMps: 1500 },
    noise: QUIET_NOISE,
    faults: NO_FAULTS,
    ...overrides,
  };
}

/** The same spec with the logged setup equal to the true one (assumed sound speed = the water's). */
function matchedSpec(overrides: Partial<DiveSpec> = {}): DiveSpec {
  const probe = simulateDive(cleanSpec(overrides));
  return cleanSpec({ ...overrides, loggedSetup: { ...TRUE_SETUP, soundSpeedMps: probe.truth.water.soundSpeedMps } });
}

describe('simulateDive', () => {
  it('logs the true track exactly when noise and faults are off and the logged setup equals the true one', () => {
    const dive = simulateDive(matchedSpec());
    expect(dive.truth.faults).toEqual([]);
    expect(dive.vehicleLog.length).toBe(dive.truth.vehicle.timeMs.length);
    let worstM = 0;
    for (let i = 0; i < dive.vehicleLog.length; i++) {
      const error = inverseGeodesic(
        dive.vehicleLog.latDeg[i] as number,
        dive.vehicleLog.lonDeg[i] as number,
        dive.truth.vehicle.latDeg[i] as number,
        dive.truth.vehicle.lonDeg[i] as number,
      ).distanceM;
      worstM = Math.max(worstM, error);
      expect(dive.vehicleLog.timeMs[i]).toBe(dive.truth.vehicle.timeMs[i]);
      expect(dive.vehicleLog.depthM[i]).toBe(dive.truth.vehicle.depthM[i]);
    }
    expect(worstM).toBeLessThan(1e-6);
  });

  it('takes the water sound speed from Mackenzie (1981) at the stated depth and reports it in the truth', () => {
    const dive = simulateDive(cleanSpec());
    const { water } = dive.truth;
    expect(water.soundSpeedMps).toBeCloseTo(soundSpeedMackenzie1981(7.5, 33.8, water.soundSpeedDepthM), 2);
    expect(dive.truth.trueSetup.soundSpeedMps).toBe(water.soundSpeedMps);
  });

  it('logs slant ranges scaled by assumed / water sound speed (1 % too fast → 1 % long) and flags a sound-speed fault', () => {
    const matched = matchedSpec();
    const water = matched.loggedSetup.soundSpeedMps;
    const dive = simulateDive({ ...matched, loggedSetup: { ...matched.loggedSetup, soundSpeedMps: water * 1.01 } });
    for (let i = 0; i < dive.vehicleLog.length; i += 37) {
      const t = dive.vehicleLog.truthIndex[i] as number;
      expect((dive.vehicleLog.slantRangeM[i] as number) / (dive.truth.vehicle.slantRangeM[t] as number)).toBeCloseTo(
        1.01,
        9,
      );
    }
    expect(dive.truth.faults.map((f) => f.kind)).toEqual(['sound-speed-error']);
  });

  it('keeps slant range² = horizontal² + vertical² in the truth', () => {
    const dive = simulateDive(matchedSpec());
    const v = dive.truth.vehicle;
    for (let i = 0; i < v.timeMs.length; i += 53) {
      // Rebuild the transceiver position independently: re-observe with the same antenna and heading.
      const s = dive.truth.surface;
      const horizontal = inverseGeodesic(
        s.latDeg[i] as number,
        s.lonDeg[i] as number,
        v.latDeg[i] as number,
        v.lonDeg[i] as number,
      ).distanceM;
      // The transceiver is 4.34 m from the antenna, so the antenna-based horizontal differs by at most that.
      const vertical = (v.depthM[i] as number) - TRUE_SETUP.draftM;
      const fromSlant = Math.sqrt(Math.max(0, (v.slantRangeM[i] as number) ** 2 - vertical ** 2));
      expect(Math.abs(fromSlant - horizontal)).toBeLessThanOrEqual(Math.hypot(4.2, 1.1) + 1e-6);
    }
  });

  it('drops whole runs of fixes in dropouts and lists each with its span; no other rows go missing', () => {
    const dive = simulateDive(cleanSpec({ faults: { ...NO_FAULTS, dropoutsPerHour: 30 } }));
    const dropouts = dive.truth.faults.filter((f) => f.kind === 'dropout');
    expect(dropouts.length).toBeGreaterThan(0);
    const logged = new Set(Array.from(dive.vehicleLog.truthIndex));
    const step = dive.truth.sampleIntervalS * 1000;
    let missing = 0;
    for (let i = 0; i < dive.truth.vehicle.timeMs.length; i++) {
      const t = dive.truth.vehicle.timeMs[i] as number;
      const inDropout = dropouts.some((f) => t >= f.startTimeMs && t <= f.endTimeMs);
      expect(logged.has(i)).toBe(!inDropout);
      if (inDropout) missing++;
    }
    const listed = dropouts.reduce((sum, f) => sum + (f.endTimeMs - f.startTimeMs) / step + 1, 0);
    expect(missing).toBe(listed);
  });

  it('adds multipath outliers of the listed size to the logged range, on exactly the listed fixes', () => {
    const matched = matchedSpec();
    const dive = simulateDive({ ...matched, faults: { ...NO_FAULTS, multipathRate: 0.05 } });
    const outliers = new Map(
      dive.truth.faults.filter((f) => f.kind === 'multipath-outlier').map((f) => [f.startTimeMs, f.detail]),
    );
    expect(outliers.size).toBeGreaterThan(5);
    for (let i = 0; i < dive.vehicleLog.length; i++) {
      const t = dive.vehicleLog.truthIndex[i] as number;
      const excess = (dive.vehicleLog.slantRangeM[i] as number) - (dive.truth.vehicle.slantRangeM[t] as number);
      const detail = outliers.get(dive.truth.vehicle.timeMs[t] as number);
      if (detail === undefined) expect(Math.abs(excess)).toBeLessThan(1e-6);
      else {
        expect(excess).toBeCloseTo(detail.rangeErrorM as number, 6);
        expect(excess).toBeGreaterThanOrEqual(3);
        expect(excess).toBeLessThanOrEqual(25);
      }
    }
  });

  it('writes repeated and backwards timestamps only where the faults say, one row each', () => {
    const dive = simulateDive(cleanSpec({ faults: { ...NO_FAULTS, timeGlitchesPerHour: 120 } }));
    const glitches = dive.truth.faults.filter((f) => f.kind === 'repeated-time' || f.kind === 'backwards-time');
    expect(glitches.length).toBeGreaterThan(3);
    const byTime = new Map(glitches.map((f) => [f.startTimeMs, f]));
    for (let i = 1; i < dive.vehicleLog.length; i++) {
      const t = dive.vehicleLog.truthIndex[i] as number;
      const trueTime = dive.truth.vehicle.timeMs[t] as number;
      const glitch = byTime.get(trueTime);
      const step = (dive.vehicleLog.timeMs[i] as number) - (dive.vehicleLog.timeMs[i - 1] as number);
      if (glitch === undefined) expect(dive.vehicleLog.timeMs[i]).toBe(trueTime);
      else if (glitch.kind === 'repeated-time') expect(step).toBe(0);
      else expect(step).toBeLessThan(0);
    }
  });

  it('drifts a boat away and back during a surface-drift episode, and only then', () => {
    const dive = simulateDive(
      cleanSpec({
        flight: { ...cleanSpec().flight, durationS: 1800 },
        surfaceUnit: { ...cleanSpec().surfaceUnit, wanderSigmaM: 0, headingWanderSigmaDeg: 0 },
        faults: { ...NO_FAULTS, driftEpisodesPerHour: 4 },
      }),
    );
    const drifts = dive.truth.faults.filter((f) => f.kind === 'surface-drift');
    expect(drifts.length).toBeGreaterThan(0);
    const s = dive.truth.surface;
    const home = { lat: s.latDeg[0] as number, lon: s.lonDeg[0] as number };
    for (let i = 0; i < s.timeMs.length; i++) {
      const away = inverseGeodesic(home.lat, home.lon, s.latDeg[i] as number, s.lonDeg[i] as number).distanceM;
      const episode = drifts.find(
        (f) => (s.timeMs[i] as number) >= f.startTimeMs && (s.timeMs[i] as number) <= f.endTimeMs,
      );
      if (episode === undefined) expect(away).toBeLessThan(1e-6);
      else expect(away).toBeLessThanOrEqual((episode.detail.maxOffsetM as number) + 1e-6);
    }
    const biggest = drifts[0] as (typeof drifts)[number];
    const middle = (biggest.startTimeMs + biggest.endTimeMs) / 2;
    const i = s.timeMs.indexOf(Math.round(middle / 1000) * 1000);
    const peak = inverseGeodesic(home.lat, home.lon, s.latDeg[i] as number, s.lonDeg[i] as number).distanceM;
    expect(peak).toBeCloseTo(biggest.detail.maxOffsetM as number, 0);
  });

  it('is deterministic: the same spec gives the same numbers, another seed different ones', () => {
    const spec = cleanSpec({ noise: { ...QUIET_NOISE, rangeFraction: 0.003, rangeFloorM: 0.1, gnssSigmaM: 0.4 } });
    const a = simulateDive(spec);
    const b = simulateDive(spec);
    const c = simulateDive({ ...spec, seed: 12 });
    expect(Array.from(a.vehicleLog.latDeg)).toEqual(Array.from(b.vehicleLog.latDeg));
    expect(Array.from(a.vehicleLog.slantRangeM)).not.toEqual(Array.from(c.vehicleLog.slantRangeM));
  });
});
