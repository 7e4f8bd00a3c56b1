/**
 * The demo season of the invented operator Hollowtide Subsea: three invented sites, their surface
 * units and structures, and a calendar of campaigns that yields any number of dives. Every name,
 * vessel and structure here is made up.
 */
import { DateTime } from 'luxon';
import { InvalidArgumentError } from '../errors.js';
import { magneticDeclination } from '../resolve/magnetic-declination.js';
import { soundSpeedMackenzie1981 } from '../resolve/sound-speed.js';
import type { AcousticSetup, LeverArm } from './acoustic-geometry.js';
import { createRandomSource, deriveSeed, type RandomSource } from './create-random-source.js';
import { formatDiveTruth } from './format-dive-truth.js';
import type { LocalPoint, VehiclePattern } from './sample-vehicle-path.js';
import {
  type DiveSpec,
  type SimulatedDive,
  type SimulatedSite,
  type SurfaceUnitPlan,
  simulateDive,
} from './simulate-dive.js';
import { VEHICLE_PLATFORMS, type VehiclePlatformName } from './vehicle-platforms.js';
import { LOG_DIALECTS, type LogDialect, type SimulatedFile, writeDiveLogs } from './write-dive-logs.js';

/** A demo site with what the simulator needs to plan dives there. */
export interface DemoSite extends SimulatedSite {
  /** The project the site's dives belong to, and its (invented) client. */
  projectName: string;
  client: string;
  surfaceUnit: SurfaceUnitPlan;
  /** Antenna-to-transceiver lever arm and transceiver draft of the site's surface unit. */
  leverArm: LeverArm;
  draftM: number;
  /** Usual water temperature (°C) and salinity (PSS-78) ranges over the season. */
  temperatureC: readonly [number, number];
  salinityPsu: readonly [number, number];
  /** Where vehicles launch from, local frame. */
  launch: LocalPoint;
  /** The platforms that work here. */
  platforms: readonly VehiclePlatformName[];
  /** The patterns flown here; one is drawn per dive (the platform's tether permitting). */
  patterns: readonly VehiclePattern[];
}

/**
 * The three demo sites: net pens on the south-west Norwegian coast (inside the UTM 32V exception,
 * so UTM zone 32 although the longitude alone says 31), a quay in Tasmania (southern hemisphere)
 * and a mooring field on the Scottish west coast (west of Greenwich).
 */
export const DEMO_SITES: readonly DemoSite[] = [
  {
    id: 'skarvholmen',
    name: 'Skarvholmen net pens',
    projectName: 'Skarvholmen net-pen inspections 2026',
    client: 'Brattvika Sjømat (invented)',
    originLatDeg: 59.0512,
    originLonDeg: 5.4378,
    timeZone: 'Europe/Oslo',
    crs: 'EPSG:25832',
    surfaceUnit: {
      kind: 'boat',
      name: 'MV Hollowtide Tern',
      eastM: 0,
      northM: 0,
      headingDeg: 205,
      wanderSigmaM: 1.5,
      headingWanderSigmaDeg: 3,
    },
    leverArm: { forwardM: -4.2, starboardM: 1.1, downM: 3.6 },
    draftM: 2.1,
    temperatureC: [5.5, 9],
    salinityPsu: [32.5, 34.5],
    launch: { eastM: -3, northM: -6, depthM: 0.3 },
    platforms: ['inspection-rov', 'inspection-rov', 'work-rov'],
    patterns: [
      {
        kind: 'circles',
        centreEastM: 42,
        centreNorthM: 30,
        radiusM: 27.5,
        topDepthM: 3,
        bottomDepthM: 18,
        laps: 4,
        clockwise: true,
      },
      {
        kind: 'circles',
        centreEastM: -46,
        centreNorthM: 36,
        radiusM: 28,
        topDepthM: 4,
        bottomDepthM: 20,
        laps: 5,
        clockwise: false,
      },
      { kind: 'station', target: { eastM: 84, northM: -58, depthM: 35.5 }, headingDeg: 310, wanderSigmaM: 0.4 },
      { kind: 'transit', from: { eastM: 42, northM: -5, depthM: 12 }, to: { eastM: -46, northM: 2, depthM: 14 } },
    ],
  },
  {
    id: 'greywhistle',
    name: 'Greywhistle Quay',
    projectName: 'Greywhistle Quay wall survey',
    client: 'Greywhistle Harbour Board (invented)',
    originLatDeg: -42.8821,
    originLonDeg: 147.3419,
    timeZone: 'Australia/Hobart',
    crs: 'EPSG:7855',
    surfaceUnit: {
      kind: 'quay',
      name: 'Quay station GQ-2',
      eastM: 0,
      northM: 0,
      headingDeg: 90,
      wanderSigmaM: 0,
      headingWanderSigmaDeg: 0,
    },
    leverArm: { forwardM: 2.4, starboardM: 0, downM: 4.1 },
    draftM: 1.5,
    temperatureC: [13, 17],
    salinityPsu: [31, 34.5],
    launch: { eastM: 5, northM: 3, depthM: 0.3 },
    platforms: ['inspection-rov', 'inspection-rov', 'diver'],
    patterns: [
      {
        kind: 'lawnmower',
        wallStartEastM: 2,
        wallStartNorthM: -15,
        wallAzimuthDeg: 0,
        wallLengthM: 30,
        firstOffsetM: 2,
        lineSpacingM: 3,
        lineCount: 5,
        wallFootDepthM: 9,
        seabedSlope: 0.08,
        altitudeM: 1.5,
      },
      {
        kind: 'lawnmower',
        wallStartEastM: 2,
        wallStartNorthM: -90,
        wallAzimuthDeg: 0,
        wallLengthM: 180,
        firstOffsetM: 2,
        lineSpacingM: 4,
        lineCount: 8,
        wallFootDepthM: 10,
        seabedSlope: 0.1,
        altitudeM: 1.5,
      },
      { kind: 'station', target: { eastM: 14, northM: 22, depthM: 9.5 }, headingDeg: 270, wanderSigmaM: 0.25 },
      { kind: 'transit', from: { eastM: 10, northM: -30, depthM: 9 }, to: { eastM: 40, northM: 30, depthM: 11 } },
    ],
  },
  {
    id: 'carrach',
    name: 'Carrach Sound moorings',
    projectName: 'Carrach Sound mooring and cable checks',
    client: 'Carrach Marine Trust (invented)',
    originLatDeg: 56.4421,
    originLonDeg: -5.6195,
    timeZone: 'Europe/London',
    crs: 'EPSG:32630',
    surfaceUnit: {
      kind: 'boat',
      name: 'MV Hollowtide Kittiwake',
      eastM: 0,
      northM: 0,
      headingDeg: 40,
      wanderSigmaM: 2,
      headingWanderSigmaDeg: 4,
    },
    leverArm: { forwardM: 1.8, starboardM: -2.3, downM: 3.2 },
    draftM: 1.8,
    temperatureC: [7.5, 11],
    salinityPsu: [33, 34.8],
    launch: { eastM: 4, northM: 4, depthM: 0.3 },
    platforms: ['work-rov', 'inspection-rov'],
    patterns: [
      { kind: 'transit', from: { eastM: -120, northM: -85, depthM: 27 }, to: { eastM: 150, northM: 95, depthM: 33 } },
      { kind: 'station', target: { eastM: 62, northM: -41, depthM: 30.5 }, headingDeg: 125, wanderSigmaM: 0.5 },
      { kind: 'station', target: { eastM: -55, northM: 70, depthM: 29 }, headingDeg: 20, wanderSigmaM: 0.5 },
      {
        kind: 'circles',
        centreEastM: 20,
        centreNorthM: 35,
        radiusM: 12,
        topDepthM: 6,
        bottomDepthM: 24,
        laps: 3,
        clockwise: true,
      },
    ],
  },
];

/** A campaign: days in a row at one site. */
interface Campaign {
  siteId: string;
  /** First day, local date `yyyy-MM-dd`. */
  firstDay: string;
  days: number;
}

// One cycle of campaigns; later cycles repeat it 16 weeks on. The Skarvholmen campaign spans the
// night of 29 March 2026, when Europe/Oslo moves to summer time.
const CAMPAIGN_CYCLE: readonly Campaign[] = [
  { siteId: 'greywhistle', firstDay: '2026-02-16', days: 5 },
  { siteId: 'carrach', firstDay: '2026-03-09', days: 5 },
  { siteId: 'skarvholmen', firstDay: '2026-03-26', days: 5 },
  { siteId: 'greywhistle', firstDay: '2026-04-13', days: 4 },
  { siteId: 'carrach', firstDay: '2026-05-04', days: 5 },
  { siteId: 'skarvholmen', firstDay: '2026-05-25', days: 4 },
];
const CYCLE_DAYS = 16 * 7;

/** The night dive whose local times cross the 2026 summer-time change in Europe/Oslo (01:40 CET → 04:05 CEST). */
const DST_NIGHT_DIVE = { siteId: 'skarvholmen', startUtc: '2026-03-29T00:40:00Z', minutes: 85 } as const;

// The newest bundled World Magnetic Model (WMM2025) is valid to 2029-11-13.
const LAST_MODELLED_TIME_MS = Date.UTC(2029, 10, 1);

/** One planned dive: its spec and the layout its logs are written in. */
export interface PlannedDive {
  index: number;
  spec: DiveSpec;
  dialect: LogDialect;
}

/** Options of `planSeason`. */
export interface SeasonOptions {
  /** Seed of the whole season; each dive's own seed derives from it and its index. */
  seed: number;
  /** Number of dives (at least 1). */
  dives: number;
  /** Fixed dive length in minutes for every dive; default: drawn per dive (25–110 min). */
  diveMinutes?: number;
  /** Interval between fixes, seconds; default 1. */
  sampleIntervalS?: number;
  /** Write every dive in this layout instead of letting the layouts take turns. */
  dialect?: LogDialect;
}

function siteById(id: string): DemoSite {
  const site = DEMO_SITES.find((s) => s.id === id);
  if (site === undefined) throw new InvalidArgumentError(`no demo site ${id}`);
  return site;
}

function round(value: number, decimals: number): number {
  const scale = 10 ** decimals;
  return Math.round(value * scale) / scale;
}

function loggedSetupFor(trueSetup: Omit<AcousticSetup, 'soundSpeedMps'>, random: RandomSource): AcousticSetup {
  const logged: AcousticSetup = { ...trueSetup, leverArm: { ...trueSetup.leverArm }, soundSpeedMps: 1500 };
  // Setup mistakes the trade knows (common practice): a forgotten declination, an uncalibrated
  // heading offset, a lever arm left at zero or with swapped axes, a stale draft.
  if (random.chance(0.15)) logged.declinationDeg = 0;
  if (random.chance(0.15)) logged.installationOffsetDeg = 0;
  if (random.chance(0.1)) logged.leverArm = { forwardM: 0, starboardM: 0, downM: 0 };
  else if (random.chance(0.05))
    logged.leverArm = {
      forwardM: trueSetup.leverArm.starboardM,
      starboardM: trueSetup.leverArm.forwardM,
      downM: trueSetup.leverArm.downM,
    };
  if (random.chance(0.1)) logged.draftM = round(trueSetup.draftM + random.pick([-1, -0.5, 0.5, 1]), 2);
  return logged;
}

function patternReach(pattern: VehiclePattern, reach: (p: LocalPoint) => number): number {
  switch (pattern.kind) {
    case 'lawnmower': {
      const far = pattern.firstOffsetM + pattern.lineSpacingM * pattern.lineCount;
      return Math.hypot(pattern.wallLengthM, far) + pattern.wallFootDepthM;
    }
    case 'circles':
      return Math.hypot(pattern.centreEastM, pattern.centreNorthM) + pattern.radiusM + pattern.bottomDepthM;
    case 'transit':
      return Math.max(reach(pattern.from), reach(pattern.to));
    case 'station':
      return reach(pattern.target);
  }
}

function patternFor(site: DemoSite, platform: VehiclePlatformName, random: RandomSource): VehiclePattern {
  const tether = VEHICLE_PLATFORMS[platform].tetherLengthM;
  const reach = (p: LocalPoint) =>
    Math.hypot(p.eastM - site.surfaceUnit.eastM, p.northM - site.surfaceUnit.northM, p.depthM);
  const fits = site.patterns.filter((pattern) => patternReach(pattern, reach) < tether * 0.8);
  return random.pick(fits.length > 0 ? fits : site.patterns);
}

function planOneDive(
  index: number,
  seasonSeed: number,
  site: DemoSite,
  startTimeMs: number,
  durationS: number,
  dialect: LogDialect,
  sampleIntervalS: number,
): PlannedDive {
  const seed = deriveSeed(seasonSeed, index);
  const random = createRandomSource(deriveSeed(seed, 0x5e7));
  const platformName = random.pick(site.platforms);
  const platform = VEHICLE_PLATFORMS[platformName];
  const pattern = patternFor(site, platformName, random);
  const declinationDeg = round(
    // Very long seasons run past the bundled World Magnetic Model; the declination then stays at its last modelled value.
    magneticDeclination(site.originLatDeg, site.originLonDeg, Math.min(startTimeMs, LAST_MODELLED_TIME_MS))
      .declinationDeg,
    2,
  );
  const trueSetup = {
    declinationDeg,
    installationOffsetDeg: round(random.between(-3, 3), 1),
    leverArm: site.leverArm,
    draftM: site.draftM,
  };
  const loggedSetup = loggedSetupFor(trueSetup, random);
  const water = {
    temperatureC: round(random.between(...site.temperatureC), 1),
    salinityPsu: round(random.between(...site.salinityPsu), 1),
  };
  // About two dives in five had the sound speed measured near 10 m and entered, rounded to 1 m/s
  // (close to the water's, not equal); the rest ran on the 1500 m/s default.
  if (random.chance(0.4))
    loggedSetup.soundSpeedMps = Math.round(soundSpeedMackenzie1981(water.temperatureC, water.salinityPsu, 10));
  const boat = site.surfaceUnit.kind === 'boat';
  const spec: DiveSpec = {
    diveId: `HT-${String(index + 1).padStart(3, '0')}`,
    seed,
    site: {
      id: site.id,
      name: site.name,
      originLatDeg: site.originLatDeg,
      originLonDeg: site.originLonDeg,
      timeZone: site.timeZone,
      crs: site.crs,
    },
    startTimeMs,
    sampleIntervalS,
    flight: {
      platform,
      launch: site.launch,
      pattern,
      speedMps: round(random.between(0.35, 0.7) * platform.maxSpeedMps, 2),
      durationS,
    },
    surfaceUnit: site.surfaceUnit,
    water,
    trueSetup,
    loggedSetup,
    noise: {
      rangeFraction: round(random.between(0.002, 0.005), 4),
      rangeFloorM: 0.1,
      bearingSigmaDeg: round(random.between(0.2, 0.5), 2),
      compassSigmaDeg: round(random.between(0.1, 0.3), 2),
      gnssSigmaM: boat ? 0.4 : 0.02,
      depthSigmaM: 0.05,
      vehicleHeadingSigmaDeg: 0.5,
    },
    faults: {
      multipathRate: round(boat ? random.between(0.001, 0.004) : random.between(0.004, 0.012), 4),
      multipathRangeErrorM: [3, 25],
      multipathBearingErrorDeg: 15,
      dropoutsPerHour: round(random.between(0.5, 4), 1),
      dropoutDurationS: [5, 45],
      timeGlitchesPerHour: round(random.between(0.2, 1.5), 1),
      driftEpisodesPerHour: boat ? round(random.between(0, 0.8), 1) : 0,
      driftSpeedMps: [0.1, 0.35],
      driftDurationS: [60, 180],
    },
  };
  return { index, spec, dialect };
}

/**
 * Plans a season of `dives` dives for Hollowtide Subsea: campaigns rotate over the demo sites
 * (two to five weeks apart, repeating every 16 weeks), one to three dives a day starting from
 * local morning, each with its platform, pattern, water, true and logged setup, noise and fault
 * rates, and a log layout (the layouts take turns, so every one appears, unless `dialect` names
 * one). A season that reaches 29 March 2026 (the third campaign, after some 20–35 dives) holds
 * a night dive at Skarvholmen across the Europe/Oslo summer-time change, logged in local time. Pure and deterministic. Throws `InvalidArgumentError`
 * for fewer than one dive, a non-positive interval, a dive shorter than 5 minutes, or an unknown
 * layout.
 */
export function planSeason(options: SeasonOptions): PlannedDive[] {
  const { seed, dives } = options;
  const sampleIntervalS = options.sampleIntervalS ?? 1;
  if (!Number.isInteger(dives) || dives < 1) throw new InvalidArgumentError(`dives must be 1 or more, got ${dives}`);
  if (!(sampleIntervalS > 0))
    throw new InvalidArgumentError(`the sample interval must be positive, got ${sampleIntervalS}`);
  if (options.diveMinutes !== undefined && !(options.diveMinutes >= 5))
    throw new InvalidArgumentError(`a dive must last 5 minutes or more, got ${options.diveMinutes}`);
  if (options.dialect !== undefined && !LOG_DIALECTS.includes(options.dialect))
    throw new InvalidArgumentError(`unknown log layout ${options.dialect}; one of ${LOG_DIALECTS.join(', ')}`);
  const random = createRandomSource(seed);
  const planned: PlannedDive[] = [];
  const duration = () => 60 * (options.diveMinutes ?? Math.round(random.between(25, 110)));
  let dstDivePlanned = false;
  for (let cycle = 0; planned.length < dives; cycle++) {
    for (const campaign of CAMPAIGN_CYCLE) {
      if (planned.length >= dives) break;
      const site = siteById(campaign.siteId);
      const first = DateTime.fromISO(campaign.firstDay, { zone: site.timeZone }).plus({ days: cycle * CYCLE_DAYS });
      for (let day = 0; day < campaign.days && planned.length < dives; day++) {
        const date = first.plus({ days: day });
        if (!dstDivePlanned && cycle === 0 && site.id === DST_NIGHT_DIVE.siteId && date.toISODate() === '2026-03-29') {
          dstDivePlanned = true;
          const dialect: LogDialect = options.dialect ?? 'csv-local-time';
          const startMs = Date.parse(DST_NIGHT_DIVE.startUtc);
          planned.push(
            planOneDive(
              planned.length,
              seed,
              site,
              startMs,
              60 * (options.diveMinutes ?? DST_NIGHT_DIVE.minutes),
              dialect,
              sampleIntervalS,
            ),
          );
          continue;
        }
        const divesToday = random.pick([1, 2, 2, 2, 3, 3]);
        let next = date.set({ hour: 8, minute: 0 }).plus({ minutes: random.integer(0, 75) });
        for (let k = 0; k < divesToday && planned.length < dives; k++) {
          const durationS = duration();
          const dialect = options.dialect ?? (LOG_DIALECTS[planned.length % LOG_DIALECTS.length] as LogDialect);
          planned.push(planOneDive(planned.length, seed, site, next.toMillis(), durationS, dialect, sampleIntervalS));
          next = next.plus({ seconds: durationS, minutes: random.integer(30, 90) });
        }
      }
    }
  }
  return planned;
}

/** One dive of a season, simulated and written: the dive, its log files, and its truth as JSON text. */
export interface SeasonDive {
  planned: PlannedDive;
  dive: SimulatedDive;
  files: SimulatedFile[];
  /** `<base>.truth.json` beside the logs. */
  truthFile: { name: string; text: string };
}

/** Simulates and writes one planned dive (see `simulateDive`, `writeDiveLogs`, `formatDiveTruth`). */
export function simulatePlannedDive(planned: PlannedDive): SeasonDive {
  const dive = simulateDive(planned.spec);
  const files = writeDiveLogs(dive, planned.dialect);
  const first = files[0];
  const base = first === undefined ? planned.spec.diveId : first.name.replace(/(_vehicle)?\.[a-z]+$/, '');
  return { planned, dive, files, truthFile: { name: `${base}.truth.json`, text: formatDiveTruth(dive, files) } };
}

/**
 * Yields a season's dives one at a time (so a caller can write each and let it go), in plan
 * order. Same options, same bytes. Throws as `planSeason` does.
 */
export function* simulateSeason(options: SeasonOptions): Generator<SeasonDive> {
  for (const planned of planSeason(options)) yield simulatePlannedDive(planned);
}
