import { describe, expect, it } from 'vitest';
import { geodesicDistanceM } from '../geodesy/geodesic.js';
import type { Track } from '../model/track.js';
import { TrackBuilder } from '../model/track-builder.js';
import { readLog } from '../read/read-log.js';
import { solveTopsideFix } from '../simulate/acoustic-geometry.js';
import { type DiveSpec, type NoiseModel, type SimulatedDive, simulateDive } from '../simulate/simulate-dive.js';
import { VEHICLE_PLATFORMS } from '../simulate/vehicle-platforms.js';
import { type LogDialect, writeDiveLogs } from '../simulate/write-dive-logs.js';
import type { ResolveSetupInput } from './resolve-setup.js';
import { type ResolveResult, resolveTrack } from './resolve-track.js';

// Issue 7, item 7: dives simulated with a wrong logged setup, re-solved with the true one, scored
// against the simulator's truth. Invented scenario (Hollowtide Subsea, a fish-farm net inspection).

const NO_NOISE: NoiseModel = {
  rangeFraction: 0,
  rangeFloorM: 0,
  bearingSigmaDeg: 0,
  compassSigmaDeg: 0,
  // A non-zero GNSS sigma keeps the random stream in step with the noisy twin (the simulator only
  // draws GNSS noise when the sigma is positive); a nanometre changes nothing measurable.
  gnssSigmaM: 1e-9,
  depthSigmaM: 0,
  vehicleHeadingSigmaDeg: 0,
};

const NOISE: NoiseModel = {
  rangeFraction: 0.003,
  rangeFloorM: 0.05,
  bearingSigmaDeg: 0.5,
  compassSigmaDeg: 0.3,
  gnssSigmaM: 0.3,
  depthSigmaM: 0.1,
  vehicleHeadingSigmaDeg: 1,
};

function spec(noise: NoiseModel, seed = 7): DiveSpec {
  return {
    diveId: 'hollowtide-pen-3-dive-2',
    seed,
    site: {
      id: 'skarvvik',
      name: 'Skarvvik pen 3',
      originLatDeg: 62.4712,
      originLonDeg: 6.1534,
      timeZone: 'Europe/Oslo',
      crs: 'EPSG:25832',
    },
    startTimeMs: Date.UTC(2026, 4, 12, 8, 30, 0),
    sampleIntervalS: 1,
    flight: {
      platform: VEHICLE_PLATFORMS['inspection-rov'],
      launch: { eastM: 4, northM: -3, depthM: 0.5 },
      pattern: {
        kind: 'circles',
        centreEastM: 45,
        centreNorthM: 30,
        radiusM: 25,
        topDepthM: 4,
        bottomDepthM: 22,
        laps: 2,
        clockwise: true,
      },
      speedMps: 0.6,
      durationS: 900,
    },
    surfaceUnit: {
      kind: 'boat',
      name: 'MV Gullterne',
      eastM: 0,
      northM: 0,
      headingDeg: 65,
      wanderSigmaM: 1.5,
      headingWanderSigmaDeg: 4,
    },
    water: { temperatureC: 7, salinityPsu: 33.5 },
    trueSetup: {
      declinationDeg: 2.4,
      installationOffsetDeg: 3.5,
      leverArm: { forwardM: 3.2, starboardM: -1.1, downM: 2.6 },
      draftM: 1.6,
    },
    // The wrong setup the topside was given: default sound speed, no offsets, no lever arm, no draft.
    loggedSetup: {
      soundSpeedMps: 1500,
      declinationDeg: 0,
      installationOffsetDeg: 0,
      leverArm: { forwardM: 0, starboardM: 0, downM: 0 },
      draftM: 0,
    },
    noise,
    faults: {
      multipathRate: 0,
      multipathRangeErrorM: [0, 0],
      multipathBearingErrorDeg: 0,
      dropoutsPerHour: 0,
      dropoutDurationS: [0, 0],
      timeGlitchesPerHour: 0,
      driftEpisodesPerHour: 0,
      driftSpeedMps: [0, 0],
      driftDurationS: [0, 0],
    },
  };
}

function vehicleTrack(dive: SimulatedDive): Track {
  const log = dive.vehicleLog;
  const builder = new TrackBuilder(log.length);
  for (let i = 0; i < log.length; i++)
    builder.push(
      {
        timeMs: log.timeMs[i] as number,
        latDeg: log.latDeg[i] as number,
        lonDeg: log.lonDeg[i] as number,
        depthM: log.depthM[i] as number,
        headingDeg: log.headingDeg[i] as number,
        slantRangeM: log.slantRangeM[i] as number,
        bearingDeg: log.bearingDeg[i] as number,
        surfaceLatDeg: log.surfaceLatDeg[i] as number,
        surfaceLonDeg: log.surfaceLonDeg[i] as number,
        surfaceHeadingDeg: log.surfaceHeadingDeg[i] as number,
      },
      i + 2,
    );
  return builder.build({
    id: dive.spec.diveId,
    role: 'vehicle',
    provenance: {
      sourceFile: `${dive.spec.diveId}.csv`,
      format: 'csv',
      dialect: 'simulated',
      timeZone: 'UTC',
      depthSign: { rule: 'depth', doubtful: false, reason: 'simulated' },
      bearingReference: 'relative',
    },
  });
}

/** The true setup as a re-solve setup, read from the simulator's truth. */
function trueSetupOf(dive: SimulatedDive): ResolveSetupInput {
  const t = dive.truth.trueSetup;
  return {
    name: 'true setup from the simulator',
    soundSpeed: {
      loggedMps: dive.truth.loggedSetup.soundSpeedMps,
      water: { method: 'value', soundSpeedMps: t.soundSpeedMps, source: 'simulator truth' },
    },
    bearingReference: { value: 'relative', source: 'simulator' },
    headingOffset: { valueDeg: t.installationOffsetDeg, source: 'simulator truth' },
    declination: { method: 'value', valueDeg: t.declinationDeg, source: 'simulator truth' },
    leverArm: { ...t.leverArm, source: 'simulator truth' },
    transceiverDraft: { valueM: t.draftM, source: 'simulator truth' },
  };
}

function rms(values: readonly number[]): number {
  return Math.sqrt(values.reduce((s, v) => s + v * v, 0) / values.length);
}

/** Per-fix horizontal error of the logged track against the truth. */
function loggedErrors(dive: SimulatedDive): number[] {
  const log = dive.vehicleLog;
  const truth = dive.truth.vehicle;
  return Array.from({ length: log.length }, (_, i) => {
    const k = log.truthIndex[i] as number;
    return geodesicDistanceM(
      truth.latDeg[k] as number,
      truth.lonDeg[k] as number,
      log.latDeg[i] as number,
      log.lonDeg[i] as number,
    );
  });
}

/** Per-fix horizontal error of a re-solved track against the truth, keyed by log row. */
function resolvedErrors(dive: SimulatedDive, result: ResolveResult): Map<number, number> {
  const errors = new Map<number, number>();
  const truth = dive.truth.vehicle;
  for (let j = 0; j < result.track.length; j++) {
    const row = result.sourceIndex[j] as number;
    const k = dive.vehicleLog.truthIndex[row] as number;
    errors.set(
      row,
      geodesicDistanceM(
        truth.latDeg[k] as number,
        truth.lonDeg[k] as number,
        result.track.columns.latDeg[j] as number,
        result.track.columns.lonDeg[j] as number,
      ),
    );
  }
  return errors;
}

describe('resolveTrack against the simulator', () => {
  it('brings a noise-free dive logged with a wrong setup within 0.05 m RMS of the truth', () => {
    const dive = simulateDive(spec(NO_NOISE));
    const result = resolveTrack(vehicleTrack(dive), trueSetupOf(dive));
    const before = rms(loggedErrors(dive));
    const after = rms([...resolvedErrors(dive, result).values()]);
    expect(before).toBeGreaterThan(1);
    expect(after).toBeLessThan(0.05);
    // Every fix was solved (a noise-free range is never shorter than the depth difference).
    expect(result.rejections).toEqual([]);
  });

  it('also gets there from water temperature and salinity by Mackenzie 1981', () => {
    // The simulator's water speed is Mackenzie at one mid-path depth; the re-solve averages the
    // equation over each fix's own path, which differs by centimetres at these ranges.
    const dive = simulateDive(spec(NO_NOISE));
    const setup = trueSetupOf(dive);
    const result = resolveTrack(vehicleTrack(dive), {
      ...setup,
      soundSpeed: {
        loggedMps: 1500,
        water: { method: 'mackenzie-1981', temperatureC: 7, salinityPsu: 33.5, source: 'CTD cast' },
      },
    });
    expect(rms([...resolvedErrors(dive, result).values()])).toBeLessThan(0.05);
  });

  // GPX is left out: the reader does not yet take the acoustic observations from the simulator's
  // GPX extensions, so there is nothing to re-solve from.
  it.each<LogDialect>(['csv', 'csv-semicolon-decimal-comma', 'csv-ddm', 'csv-crlf-bom'])(
    'works through the log file the simulator writes (%s) and the reader',
    (dialect) => {
      const dive = simulateDive(spec(NO_NOISE));
      const file = writeDiveLogs(dive, dialect).find((f) => f.role !== 'surface');
      if (file === undefined) throw new Error(`no vehicle log in ${dialect}`);
      const read = readLog({ fileName: file.name, content: file.text });
      const track = read.tracks.find((t) => t.role === 'vehicle');
      if (track === undefined) throw new Error(`no vehicle track read from ${file.name}`);
      expect(track.length).toBe(dive.vehicleLog.length);
      // The bearing reference is left to the log: the column is named bearing_rel_deg.
      const result = resolveTrack(track, { ...trueSetupOf(dive), bearingReference: { value: 'from-log' } });
      expect(result.applied.bearingReference).toBe('relative');
      expect(result.rejections).toEqual([]);
      // Rounding in the written file (7 decimals of a degree ≈ 1 cm, ranges to the millimetre)
      // is all that separates the result from the truth.
      expect(rms([...resolvedErrors(dive, result).values()])).toBeLessThan(0.05);
    },
  );

  it('on a noisy dive removes the error the setup explains and leaves only the noise', () => {
    const noisy = simulateDive(spec(NOISE));
    const twin = simulateDive(spec(NO_NOISE));
    // The twin has the same truth (same seed, same random stream) and no noise: its logged error is
    // the setup error alone.
    expect(Array.from(twin.truth.vehicle.latDeg)).toEqual(Array.from(noisy.truth.vehicle.latDeg));
    const setupError = rms(loggedErrors(twin));

    const result = resolveTrack(vehicleTrack(noisy), trueSetupOf(noisy));
    // Noise can make a slant range shorter than the depth difference; those fixes are rejected
    // with a reason, never clamped, and there are few of them.
    for (const r of result.rejections) expect(r.reason).toBe('vertical-separation-exceeds-slant-range');
    expect(result.rejections.length).toBeLessThan(noisy.vehicleLog.length * 0.02);

    const resolved = resolvedErrors(noisy, result);
    const rows = [...resolved.keys()];
    const logged = loggedErrors(noisy);
    const before = rms(rows.map((r) => logged[r] as number));
    const after = rms(rows.map((r) => resolved.get(r) as number));

    // The noise floor: the simulator's own topside given the true setup and the same noisy observations.
    const log = noisy.vehicleLog;
    const floor = rms(
      rows.map((r) => {
        const fix = solveTopsideFix(
          log.surfaceLatDeg[r] as number,
          log.surfaceLonDeg[r] as number,
          log.surfaceHeadingDeg[r] as number,
          ((log.slantRangeM[r] as number) * noisy.truth.trueSetup.soundSpeedMps) / 1500,
          log.bearingDeg[r] as number,
          log.depthM[r] as number,
          noisy.truth.trueSetup,
        );
        const k = log.truthIndex[r] as number;
        return geodesicDistanceM(
          noisy.truth.vehicle.latDeg[k] as number,
          noisy.truth.vehicle.lonDeg[k] as number,
          fix.latDeg,
          fix.lonDeg,
        );
      }),
    );
    expect(after).toBeLessThan(before);
    expect(Math.abs(after - floor)).toBeLessThan(0.01);
    // Setup error and noise are independent, so their squares add: the re-solve takes away the
    // setup's share (within 10 %, the sampling spread of one dive; measured 0.04 % on this seed).
    expect(before * before - after * after).toBeGreaterThan(0.9 * setupError * setupError);
    expect(before * before - after * after).toBeLessThan(1.1 * setupError * setupError);
  });
});
