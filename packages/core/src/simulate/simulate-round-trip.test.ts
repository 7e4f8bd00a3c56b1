import { describe, expect, it } from 'vitest';
import { inverseGeodesic } from '../geodesy/geodesic.js';
import { readLog } from '../read/read-log.js';
import { resolveTrack } from '../resolve/resolve-track.js';
import { simulateDive } from './simulate-dive.js';
import { planSeason } from './simulate-season.js';
import { writeDiveLogs } from './write-dive-logs.js';

// The contract between the simulator and re-solving, end to end: a noise-free dive logged with a
// wrong setup, written as CSV, read back by the CSV reader and re-solved with the true setup lands
// on the true track (to the CSV's rounding: 1e-7° ≈ 1 cm, 0.01 m, 0.01°, 0.1° heading).
describe('simulateDive (round trip through the CSV reader and resolveTrack)', () => {
  it('re-solving the logged observations with the true setup recovers the true track', () => {
    const planned = planSeason({ seed: 3, dives: 40, diveMinutes: 8 }).find((p) => p.spec.site.id === 'carrach');
    if (planned === undefined) throw new Error('no Carrach dive in the season');
    const quiet = {
      rangeFraction: 0,
      rangeFloorM: 0,
      bearingSigmaDeg: 0,
      compassSigmaDeg: 0,
      gnssSigmaM: 0,
      depthSigmaM: 0,
      vehicleHeadingSigmaDeg: 0,
    };
    const spec = {
      ...planned.spec,
      noise: quiet,
      faults: { ...planned.spec.faults, multipathRate: 0, dropoutsPerHour: 0, timeGlitchesPerHour: 0 },
      // A wrong logged setup: default sound speed, forgotten declination, no heading offset, no lever arm, stale draft.
      loggedSetup: {
        soundSpeedMps: 1500,
        declinationDeg: 0,
        installationOffsetDeg: 0,
        leverArm: { forwardM: 0, starboardM: 0, downM: 0 },
        draftM: 1,
      },
      trueSetup: { ...planned.spec.trueSetup, installationOffsetDeg: 2.5 },
    };
    const dive = simulateDive(spec);
    const [vehicleFile] = writeDiveLogs(dive, 'csv');
    const read = readLog({ fileName: vehicleFile?.name ?? '', content: vehicleFile?.text ?? '' });
    const track = read.tracks.find((t) => t.role === 'vehicle');
    if (track === undefined) throw new Error('the reader found no vehicle track');
    expect(track.length).toBe(dive.vehicleLog.length);

    const truth = dive.truth.trueSetup;
    const result = resolveTrack(track, {
      soundSpeed: { loggedMps: 1500, water: { method: 'value', soundSpeedMps: truth.soundSpeedMps } },
      bearingReference: { value: 'relative' },
      headingOffset: { valueDeg: truth.installationOffsetDeg },
      declination: { method: 'value', valueDeg: truth.declinationDeg },
      leverArm: truth.leverArm,
      transceiverDraft: { valueM: truth.draftM },
    });
    expect(result.rejections).toEqual([]);
    let worstLoggedM = 0;
    let worstExcessM = Number.NEGATIVE_INFINITY;
    for (let i = 0; i < result.track.length; i++) {
      const source = result.sourceIndex[i] as number;
      const t = dive.vehicleLog.truthIndex[source] as number;
      const trueLat = dive.truth.vehicle.latDeg[t] as number;
      const trueLon = dive.truth.vehicle.lonDeg[t] as number;
      const resolvedM = inverseGeodesic(
        result.track.columns.latDeg[i] as number,
        result.track.columns.lonDeg[i] as number,
        trueLat,
        trueLon,
      ).distanceM;
      // Rounding in the CSV: heading 0.1° and bearing 0.01° (half of each), slant range and depth
      // 0.01 m, positions 1e-7°: the angle turns the fix by up to 0.055° of its horizontal range.
      const horizontalM = Math.sqrt(
        Math.max(
          0,
          (dive.truth.vehicle.slantRangeM[t] as number) ** 2 -
            ((dive.truth.vehicle.depthM[t] as number) - truth.draftM) ** 2,
        ),
      );
      const allowedM = horizontalM * ((0.055 * Math.PI) / 180) + 0.05;
      worstExcessM = Math.max(worstExcessM, resolvedM - allowedM);
      worstLoggedM = Math.max(
        worstLoggedM,
        inverseGeodesic(
          dive.vehicleLog.latDeg[source] as number,
          dive.vehicleLog.lonDeg[source] as number,
          trueLat,
          trueLon,
        ).distanceM,
      );
    }
    // The wrong setup misplaced the vehicle by metres; the true setup brings it back within the rounding.
    expect(worstLoggedM).toBeGreaterThan(2);
    expect(worstExcessM).toBeLessThanOrEqual(0);
  });
});

// Every observation the simulator logs in GPX (its own extension elements) must come back through
// the GPX reader, as it does through the CSV reader: values to the GPX text's rounding.
describe('simulated GPX logs (round trip through the GPX reader)', () => {
  it('reads depth, heading, slant range and bearing of every vehicle fix', () => {
    const planned = planSeason({ seed: 5, dives: 12, diveMinutes: 6 })[0];
    if (planned === undefined) throw new Error('no dive planned');
    const dive = simulateDive(planned.spec);
    const [file] = writeDiveLogs(dive, 'gpx');
    const read = readLog({ fileName: file?.name ?? '', content: file?.text ?? '' });
    const track = read.tracks.find((t) => t.role === 'vehicle');
    if (track === undefined) throw new Error('the reader found no vehicle track');
    const log = dive.vehicleLog;
    expect(track.length).toBe(log.length);
    const c = track.columns;
    for (let i = 0; i < log.length; i++) {
      expect(c.depthM[i]).toBeCloseTo(log.depthM[i] as number, 2);
      expect(c.headingDeg[i]).toBeCloseTo(log.headingDeg[i] as number, 1);
      expect(c.slantRangeM[i]).toBeCloseTo(log.slantRangeM[i] as number, 2);
      // bearings are azimuths: 359.996 is written 360.00 and read back as 0
      const bearingError = Math.abs((((c.bearingDeg[i] as number) - (log.bearingDeg[i] as number) + 540) % 360) - 180);
      expect(bearingError).toBeLessThanOrEqual(0.005 + 1e-9);
    }
  });
});
