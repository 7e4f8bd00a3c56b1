import { createLocalFrame } from '../geodesy/create-local-frame.js';
import { normaliseAzimuthDeg } from '../model/units.js';
import { soundSpeedMackenzie1981 } from '../resolve/sound-speed.js';
import { type AcousticSetup, observeVehicle, solveTopsideFix } from './acoustic-geometry.js';
import { createRandomSource, type RandomSource } from './create-random-source.js';
import { sampleVehiclePath, type VehicleFlightPlan } from './sample-vehicle-path.js';

/** A simulated work site: an invented name, the origin of its local frame, its time zone and the client's CRS. */
export interface SimulatedSite {
  id: string;
  name: string;
  originLatDeg: number;
  originLonDeg: number;
  /** IANA time zone of the site, e.g. `Europe/Oslo`. */
  timeZone: string;
  /** The client's projected CRS, e.g. `EPSG:25832`. */
  crs: string;
}

/**
 * The surface unit: `quay` (a pole on a quay: fixed position and heading) or `boat` (holding
 * position: a slow wander of `wanderSigmaM` metres and `headingWanderSigmaDeg` degrees around the
 * held position and heading). Position in the site's local frame, metres; heading true, degrees.
 */
export interface SurfaceUnitPlan {
  kind: 'quay' | 'boat';
  /** The vessel's or the quay station's invented name. */
  name: string;
  eastM: number;
  northM: number;
  headingDeg: number;
  wanderSigmaM: number;
  headingWanderSigmaDeg: number;
}

/** Random measurement noise, one standard deviation each. */
export interface NoiseModel {
  /** Slant-range noise: `rangeFraction × slant range + rangeFloorM`, metres (e.g. 0.002 for 0.2 %). */
  rangeFraction: number;
  rangeFloorM: number;
  /** Relative-bearing noise, degrees. */
  bearingSigmaDeg: number;
  /** Surface-unit compass noise, degrees. */
  compassSigmaDeg: number;
  /** GNSS position noise per horizontal axis, metres. */
  gnssSigmaM: number;
  /** Vehicle depth-sensor noise, metres. */
  depthSigmaM: number;
  /** Vehicle heading-sensor noise, degrees. */
  vehicleHeadingSigmaDeg: number;
}

/** How often and how large the injected faults are. */
export interface FaultModel {
  /** Probability per vehicle fix of a multipath outlier. */
  multipathRate: number;
  /** Extra path length of an outlier, metres, uniform in [min, max]. */
  multipathRangeErrorM: readonly [number, number];
  /** Bearing error of an outlier, degrees, uniform in ±max. */
  multipathBearingErrorDeg: number;
  /** Acoustic dropouts (no vehicle fix logged) per hour, and their length in seconds. */
  dropoutsPerHour: number;
  dropoutDurationS: readonly [number, number];
  /** Repeated or backwards logged timestamps per hour. */
  timeGlitchesPerHour: number;
  /** Surface-unit drift episodes per hour (boats only), drift speed m/s and drift time s (it then returns as long). */
  driftEpisodesPerHour: number;
  driftSpeedMps: readonly [number, number];
  driftDurationS: readonly [number, number];
}

/** Everything that decides one simulated dive. */
export interface DiveSpec {
  diveId: string;
  /** Seed of this dive's random source. */
  seed: number;
  site: SimulatedSite;
  /** UTC ms of the first fix. */
  startTimeMs: number;
  sampleIntervalS: number;
  flight: VehicleFlightPlan;
  surfaceUnit: SurfaceUnitPlan;
  water: { temperatureC: number; salinityPsu: number };
  /** The true geometry; the water's sound speed is computed from `water`, so it is left out here. */
  trueSetup: Omit<AcousticSetup, 'soundSpeedMps'>;
  /** What the topside was told; its `soundSpeedMps` is the assumed speed. */
  loggedSetup: AcousticSetup;
  noise: NoiseModel;
  faults: FaultModel;
}

/** The kinds of fault the simulator injects. Setup faults span the whole dive. */
export type InjectedFaultKind =
  | 'multipath-outlier'
  | 'dropout'
  | 'repeated-time'
  | 'backwards-time'
  | 'surface-drift'
  | 'sound-speed-error'
  | 'heading-offset-error'
  | 'declination-error'
  | 'lever-arm-error'
  | 'draft-error';

/** One injected fault: its kind, the true UTC ms it starts and ends (equal for a single fix), and its size. */
export interface InjectedFault {
  kind: InjectedFaultKind;
  startTimeMs: number;
  endTimeMs: number;
  detail: Record<string, number>;
}

/** The rows of the vehicle log as the topside wrote them (after dropouts; logged times may repeat or go back). */
export interface SimulatedVehicleLog {
  length: number;
  /** Logged UTC ms (glitches included). */
  timeMs: Float64Array;
  /** Position the topside computed with the logged setup. */
  latDeg: Float64Array;
  lonDeg: Float64Array;
  depthM: Float64Array;
  headingDeg: Float64Array;
  slantRangeM: Float64Array;
  /** Relative to the surface unit's forward axis, degrees in [0, 360). */
  bearingDeg: Float64Array;
  surfaceLatDeg: Float64Array;
  surfaceLonDeg: Float64Array;
  /** The surface unit's compass heading as logged. */
  surfaceHeadingDeg: Float64Array;
  /** Index of the true sample each row was made from. */
  truthIndex: Uint32Array;
}

/** The surface unit's own GNSS log, one row per sample. */
export interface SimulatedSurfaceLog {
  length: number;
  timeMs: Float64Array;
  latDeg: Float64Array;
  lonDeg: Float64Array;
  /** Compass heading as logged, degrees. */
  headingDeg: Float64Array;
  /** Speed and course over ground from the GNSS, m/s and degrees true. */
  speedMps: Float64Array;
  courseDeg: Float64Array;
  /** NMEA GGA fix quality: 4 (RTK fixed) on a quay, 2 (differential) on a boat. */
  quality: number;
}

/** The truth of one dive, sampled at every interval: what really happened, beside what was logged. */
export interface DiveTruth {
  diveId: string;
  startTimeMs: number;
  endTimeMs: number;
  sampleIntervalS: number;
  /** The water's sound speed (Mackenzie 1981) at `soundSpeedDepthM`, used as the true `soundSpeedMps`. */
  water: { temperatureC: number; salinityPsu: number; soundSpeedDepthM: number; soundSpeedMps: number };
  trueSetup: AcousticSetup;
  loggedSetup: AcousticSetup;
  faults: InjectedFault[];
  vehicle: {
    timeMs: Float64Array;
    latDeg: Float64Array;
    lonDeg: Float64Array;
    depthM: Float64Array;
    headingDeg: Float64Array;
    /** True slant range and azimuth from the transceiver, metres and degrees. */
    slantRangeM: Float64Array;
    azimuthDeg: Float64Array;
  };
  /** The GNSS antenna's true track and the unit's true heading. */
  surface: { timeMs: Float64Array; latDeg: Float64Array; lonDeg: Float64Array; headingDeg: Float64Array };
}

/** One simulated dive: its spec, the truth, and the two logs the topside wrote. */
export interface SimulatedDive {
  spec: DiveSpec;
  truth: DiveTruth;
  vehicleLog: SimulatedVehicleLog;
  surfaceLog: SimulatedSurfaceLog;
}

interface DriftEpisode {
  startS: number;
  driftS: number;
  speedMps: number;
  azimuthRad: number;
}

function driftOffset(episodes: readonly DriftEpisode[], t: number): { eastM: number; northM: number } {
  for (const e of episodes) {
    if (t < e.startS || t > e.startS + 2 * e.driftS) continue;
    const out = t - e.startS <= e.driftS ? t - e.startS : 2 * e.driftS - (t - e.startS);
    const distance = e.speedMps * out;
    return { eastM: distance * Math.sin(e.azimuthRad), northM: distance * Math.cos(e.azimuthRad) };
  }
  return { eastM: 0, northM: 0 };
}

function planDriftEpisodes(spec: DiveSpec, durationS: number, random: RandomSource): DriftEpisode[] {
  const episodes: DriftEpisode[] = [];
  if (spec.surfaceUnit.kind !== 'boat' || spec.faults.driftEpisodesPerHour <= 0) return episodes;
  const count = poissonCount(random, (spec.faults.driftEpisodesPerHour * durationS) / 3600);
  for (let k = 0; k < count; k++) {
    const driftS = Math.round(random.between(...spec.faults.driftDurationS));
    const latest = durationS - 2 * driftS - 120;
    if (latest < 120) continue;
    const startS = Math.round(random.between(120, latest));
    if (episodes.some((e) => startS < e.startS + 2 * e.driftS + 60 && e.startS < startS + 2 * driftS + 60)) continue;
    episodes.push({
      startS,
      driftS,
      speedMps: random.between(...spec.faults.driftSpeedMps),
      azimuthRad: random.between(0, 2 * Math.PI),
    });
  }
  return episodes.sort((a, b) => a.startS - b.startS);
}

function poissonCount(random: RandomSource, mean: number): number {
  // Knuth's multiplication method (from memory); means here are small.
  const limit = Math.exp(-mean);
  let count = 0;
  let product = random.uniform();
  while (product > limit && count < 10_000) {
    count++;
    product *= random.uniform();
  }
  return count;
}

function setupFaults(
  truth: AcousticSetup,
  logged: AcousticSetup,
  startTimeMs: number,
  endTimeMs: number,
): InjectedFault[] {
  const faults: InjectedFault[] = [];
  const add = (kind: InjectedFaultKind, detail: Record<string, number>) =>
    faults.push({ kind, startTimeMs, endTimeMs, detail });
  if (Math.abs(logged.soundSpeedMps - truth.soundSpeedMps) > 0.5)
    add('sound-speed-error', { assumedMps: logged.soundSpeedMps, waterMps: truth.soundSpeedMps });
  if (logged.installationOffsetDeg !== truth.installationOffsetDeg)
    add('heading-offset-error', { loggedDeg: logged.installationOffsetDeg, trueDeg: truth.installationOffsetDeg });
  if (logged.declinationDeg !== truth.declinationDeg)
    add('declination-error', { loggedDeg: logged.declinationDeg, trueDeg: truth.declinationDeg });
  const a = logged.leverArm;
  const b = truth.leverArm;
  if (a.forwardM !== b.forwardM || a.starboardM !== b.starboardM || a.downM !== b.downM)
    add('lever-arm-error', {
      loggedForwardM: a.forwardM,
      loggedStarboardM: a.starboardM,
      loggedDownM: a.downM,
      trueForwardM: b.forwardM,
      trueStarboardM: b.starboardM,
      trueDownM: b.downM,
    });
  if (logged.draftM !== truth.draftM) add('draft-error', { loggedM: logged.draftM, trueM: truth.draftM });
  return faults;
}

/**
 * Simulates one dive from its spec: the true vehicle and surface-unit tracks, the acoustic
 * observations (see `acoustic-geometry.ts` for the exact conventions), noise, and the injected
 * faults (multipath outliers, dropouts, repeated and backwards timestamps, surface-unit drift
 * episodes on boats, and whole-dive setup faults wherever the logged setup differs from the true
 * one). The vehicle log's positions are what a topside computes with the logged setup. Pure and
 * deterministic: the same spec gives the same numbers. Throws `InvalidArgumentError` for an
 * unusable flight plan (see `sampleVehiclePath`).
 */
export function simulateDive(spec: DiveSpec): SimulatedDive {
  const random = createRandomSource(spec.seed);
  const frame = createLocalFrame(spec.site.originLatDeg, spec.site.originLonDeg);
  const path = sampleVehiclePath(spec.flight, spec.sampleIntervalS, random);
  const n = path.timeS.length;
  const intervalMs = spec.sampleIntervalS * 1000;
  const durationS = path.timeS[n - 1] ?? 0;

  // The water's sound speed at mid-depth of the typical acoustic path (transceiver to mean bottom depth).
  let bottomDepthSum = 0;
  let bottomCount = 0;
  for (let i = 0; i < n; i++) {
    if (path.phase[i] !== 1) continue;
    bottomDepthSum += path.depthM[i] as number;
    bottomCount++;
  }
  const meanBottomDepthM = bottomCount > 0 ? bottomDepthSum / bottomCount : 0;
  const soundSpeedDepthM = Math.round(((spec.trueSetup.draftM + meanBottomDepthM) / 2) * 10) / 10;
  const waterSoundSpeedMps =
    Math.round(soundSpeedMackenzie1981(spec.water.temperatureC, spec.water.salinityPsu, soundSpeedDepthM) * 100) / 100;
  const trueSetup: AcousticSetup = { ...spec.trueSetup, soundSpeedMps: waterSoundSpeedMps };
  const logged = spec.loggedSetup;
  const endTimeMs = spec.startTimeMs + durationS * 1000;

  const faults: InjectedFault[] = setupFaults(trueSetup, logged, spec.startTimeMs, endTimeMs);
  const drifts = planDriftEpisodes(spec, durationS, random);
  for (const d of drifts)
    faults.push({
      kind: 'surface-drift',
      startTimeMs: spec.startTimeMs + d.startS * 1000,
      endTimeMs: spec.startTimeMs + (d.startS + 2 * d.driftS) * 1000,
      detail: {
        speedMps: d.speedMps,
        azimuthDeg: (d.azimuthRad * 180) / Math.PI,
        maxOffsetM: d.speedMps * d.driftS,
      },
    });

  // Dropouts: whole runs of samples with no vehicle fix, never in the first or last minute.
  const dropped = new Uint8Array(n);
  const dropoutCount = poissonCount(random, (spec.faults.dropoutsPerHour * durationS) / 3600);
  for (let k = 0; k < dropoutCount; k++) {
    const lengthS = random.between(...spec.faults.dropoutDurationS);
    const first = Math.floor(random.between(60, Math.max(60, durationS - 60 - lengthS)) / spec.sampleIntervalS);
    const last = Math.min(n - 2, first + Math.max(0, Math.round(lengthS / spec.sampleIntervalS) - 1));
    if (first < 1 || last < first) continue;
    let overlaps = false;
    for (let i = first - 1; i <= last + 1; i++) if (dropped[i]) overlaps = true;
    if (overlaps) continue;
    for (let i = first; i <= last; i++) dropped[i] = 1;
    faults.push({
      kind: 'dropout',
      startTimeMs: spec.startTimeMs + first * intervalMs,
      endTimeMs: spec.startTimeMs + last * intervalMs,
      detail: { missingFixes: last - first + 1 },
    });
  }
  const glitchChance = (spec.faults.timeGlitchesPerHour * spec.sampleIntervalS) / 3600;

  const truth: DiveTruth = {
    diveId: spec.diveId,
    startTimeMs: spec.startTimeMs,
    endTimeMs,
    sampleIntervalS: spec.sampleIntervalS,
    water: { ...spec.water, soundSpeedDepthM, soundSpeedMps: waterSoundSpeedMps },
    trueSetup,
    loggedSetup: logged,
    faults,
    vehicle: {
      timeMs: new Float64Array(n),
      latDeg: new Float64Array(n),
      lonDeg: new Float64Array(n),
      depthM: new Float64Array(n),
      headingDeg: new Float64Array(n),
      slantRangeM: new Float64Array(n),
      azimuthDeg: new Float64Array(n),
    },
    surface: {
      timeMs: new Float64Array(n),
      latDeg: new Float64Array(n),
      lonDeg: new Float64Array(n),
      headingDeg: new Float64Array(n),
    },
  };
  const rows = n - dropped.reduce((sum, x) => sum + x, 0);
  const vehicleLog: SimulatedVehicleLog = {
    length: rows,
    timeMs: new Float64Array(rows),
    latDeg: new Float64Array(rows),
    lonDeg: new Float64Array(rows),
    depthM: new Float64Array(rows),
    headingDeg: new Float64Array(rows),
    slantRangeM: new Float64Array(rows),
    bearingDeg: new Float64Array(rows),
    surfaceLatDeg: new Float64Array(rows),
    surfaceLonDeg: new Float64Array(rows),
    surfaceHeadingDeg: new Float64Array(rows),
    truthIndex: new Uint32Array(rows),
  };
  const surfaceLog: SimulatedSurfaceLog = {
    length: n,
    timeMs: new Float64Array(n),
    latDeg: new Float64Array(n),
    lonDeg: new Float64Array(n),
    headingDeg: new Float64Array(n),
    speedMps: new Float64Array(n),
    courseDeg: new Float64Array(n),
    quality: spec.surfaceUnit.kind === 'quay' ? 4 : 2,
  };

  const unit = spec.surfaceUnit;
  const noise = spec.noise;
  const tauS = 60;
  const decay = Math.exp(-spec.sampleIntervalS / tauS);
  const kick = Math.sqrt(1 - decay * decay);
  let wanderE = unit.kind === 'boat' ? random.normal(0, unit.wanderSigmaM) : 0;
  let wanderN = unit.kind === 'boat' ? random.normal(0, unit.wanderSigmaM) : 0;
  let wanderH = unit.kind === 'boat' ? random.normal(0, unit.headingWanderSigmaDeg) : 0;
  const oneNorth = frame.inverse(0, 1);
  const oneEast = frame.inverse(1, 0);
  const degreesPerMetreNorth = oneNorth.latDeg - spec.site.originLatDeg;
  const degreesPerMetreEast = oneEast.lonDeg - spec.site.originLonDeg;
  let antenna = { latDeg: Number.NaN, lonDeg: Number.NaN };
  let cachedE = Number.NaN;
  let cachedN = Number.NaN;
  let previousE = Number.NaN;
  let previousN = Number.NaN;
  let row = 0;
  let previousLoggedTimeMs = Number.NaN;
  const [multipathMin, multipathMax] = spec.faults.multipathRangeErrorM;

  for (let i = 0; i < n; i++) {
    const t = path.timeS[i] as number;
    const timeMs = spec.startTimeMs + i * intervalMs;
    if (unit.kind === 'boat') {
      wanderE = wanderE * decay + random.normal(0, unit.wanderSigmaM * kick);
      wanderN = wanderN * decay + random.normal(0, unit.wanderSigmaM * kick);
      wanderH = wanderH * decay + random.normal(0, unit.headingWanderSigmaDeg * kick);
    }
    const drift = driftOffset(drifts, t);
    const antennaE = unit.eastM + wanderE + drift.eastM;
    const antennaN = unit.northM + wanderN + drift.northM;
    const trueHeadingDeg = normaliseAzimuthDeg(unit.headingDeg + wanderH);
    if (antennaE !== cachedE || antennaN !== cachedN) {
      antenna = frame.inverse(antennaE, antennaN);
      cachedE = antennaE;
      cachedN = antennaN;
    }
    const vehicle = frame.inverse(path.eastM[i] as number, path.northM[i] as number);
    const depthM = path.depthM[i] as number;

    truth.vehicle.timeMs[i] = timeMs;
    truth.vehicle.latDeg[i] = vehicle.latDeg;
    truth.vehicle.lonDeg[i] = vehicle.lonDeg;
    truth.vehicle.depthM[i] = depthM;
    truth.vehicle.headingDeg[i] = path.headingDeg[i] as number;
    truth.surface.timeMs[i] = timeMs;
    truth.surface.latDeg[i] = antenna.latDeg;
    truth.surface.lonDeg[i] = antenna.lonDeg;
    truth.surface.headingDeg[i] = trueHeadingDeg;

    const observation = observeVehicle(
      antenna.latDeg,
      antenna.lonDeg,
      trueHeadingDeg,
      vehicle.latDeg,
      vehicle.lonDeg,
      depthM,
      trueSetup,
      logged.soundSpeedMps,
    );
    truth.vehicle.slantRangeM[i] = observation.trueSlantRangeM;
    truth.vehicle.azimuthDeg[i] = observation.trueAzimuthDeg;

    // What the GNSS and the compass log for the surface unit.
    // GNSS noise is centimetres to a metre, so a local degrees-per-metre scale places it exactly enough.
    const loggedAntenna =
      noise.gnssSigmaM > 0
        ? {
            latDeg: antenna.latDeg + random.normal(0, noise.gnssSigmaM) * degreesPerMetreNorth,
            lonDeg: antenna.lonDeg + random.normal(0, noise.gnssSigmaM) * degreesPerMetreEast,
          }
        : antenna;
    const compassDeg = normaliseAzimuthDeg(observation.compassHeadingDeg + random.normal(0, noise.compassSigmaDeg));
    surfaceLog.timeMs[i] = timeMs;
    surfaceLog.latDeg[i] = loggedAntenna.latDeg;
    surfaceLog.lonDeg[i] = loggedAntenna.lonDeg;
    surfaceLog.headingDeg[i] = compassDeg;
    const dE = Number.isNaN(previousE) ? 0 : antennaE - previousE;
    const dN = Number.isNaN(previousN) ? 0 : antennaN - previousN;
    surfaceLog.speedMps[i] = Math.hypot(dE, dN) / spec.sampleIntervalS;
    surfaceLog.courseDeg[i] = dE === 0 && dN === 0 ? 0 : normaliseAzimuthDeg((Math.atan2(dE, dN) * 180) / Math.PI);
    previousE = antennaE;
    previousN = antennaN;

    if (dropped[i]) continue;
    let slantRangeM =
      observation.loggedSlantRangeM +
      random.normal(0, noise.rangeFraction * observation.loggedSlantRangeM + noise.rangeFloorM);
    let bearingDeg = observation.relativeBearingDeg + random.normal(0, noise.bearingSigmaDeg);
    if (i > 0 && i < n - 1 && random.chance(spec.faults.multipathRate)) {
      const rangeErrorM = random.between(multipathMin, multipathMax);
      const bearingErrorDeg = random.between(
        -spec.faults.multipathBearingErrorDeg,
        spec.faults.multipathBearingErrorDeg,
      );
      slantRangeM += rangeErrorM;
      bearingDeg += bearingErrorDeg;
      faults.push({
        kind: 'multipath-outlier',
        startTimeMs: timeMs,
        endTimeMs: timeMs,
        detail: { rangeErrorM, bearingErrorDeg },
      });
    }
    slantRangeM = Math.max(0, slantRangeM);
    bearingDeg = normaliseAzimuthDeg(bearingDeg);
    const loggedDepthM = Math.max(0, depthM + random.normal(0, noise.depthSigmaM));
    const fix = solveTopsideFix(
      loggedAntenna.latDeg,
      loggedAntenna.lonDeg,
      compassDeg,
      slantRangeM,
      bearingDeg,
      loggedDepthM,
      logged,
    );

    let loggedTimeMs = timeMs;
    if (row > 0 && i < n - 1 && random.chance(glitchChance)) {
      const backwards = random.chance(0.5);
      loggedTimeMs = backwards ? previousLoggedTimeMs - random.integer(1, 3) * 1000 : previousLoggedTimeMs;
      faults.push({
        kind: backwards ? 'backwards-time' : 'repeated-time',
        startTimeMs: timeMs,
        endTimeMs: timeMs,
        detail: { loggedTimeMs, offsetMs: loggedTimeMs - timeMs },
      });
    }
    previousLoggedTimeMs = loggedTimeMs;

    vehicleLog.timeMs[row] = loggedTimeMs;
    vehicleLog.latDeg[row] = fix.latDeg;
    vehicleLog.lonDeg[row] = fix.lonDeg;
    vehicleLog.depthM[row] = loggedDepthM;
    vehicleLog.headingDeg[row] = normaliseAzimuthDeg(
      (path.headingDeg[i] as number) + random.normal(0, noise.vehicleHeadingSigmaDeg),
    );
    vehicleLog.slantRangeM[row] = slantRangeM;
    vehicleLog.bearingDeg[row] = bearingDeg;
    vehicleLog.surfaceLatDeg[row] = loggedAntenna.latDeg;
    vehicleLog.surfaceLonDeg[row] = loggedAntenna.lonDeg;
    vehicleLog.surfaceHeadingDeg[row] = compassDeg;
    vehicleLog.truthIndex[row] = i;
    row++;
  }
  faults.sort((a, b) => a.startTimeMs - b.startTimeMs || (a.kind < b.kind ? -1 : a.kind > b.kind ? 1 : 0));
  return { spec, truth, vehicleLog, surfaceLog };
}
