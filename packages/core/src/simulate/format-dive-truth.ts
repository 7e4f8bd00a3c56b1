import type { SimulatedDive } from './simulate-dive.js';
import type { SimulatedFile } from './write-dive-logs.js';

/** The geometry contract of the logged observations, written into every truth file. */
export const OBSERVATION_CONVENTIONS = [
  'Angles in degrees clockwise from true north unless said; distances in metres; depth positive down; times UTC ms.',
  'loggedSlantRangeM = trueSlantRangeM * loggedSetup.soundSpeedMps / trueSetup.soundSpeedMps (assumed over water sound speed).',
  'trueSlantRangeM = sqrt(h^2 + (vehicleDepthM - draftM)^2), h = WGS 84 geodesic distance transceiver to vehicle.',
  'compass (logged) heading Hc = trueHeading - declinationDeg - installationOffsetDeg (declination east positive).',
  'logged bearing b = true azimuth transceiver->vehicle - trueHeading, in [0, 360); true azimuth = Hc + installationOffsetDeg + declinationDeg + b.',
  'transceiver = GNSS antenna + leverArm (forwardM along the heading, starboardM to its right), one geodesic step on WGS 84; its depth is draftM; leverArm.downM does not enter the geometry.',
  'vehicle log positions = topside solution with loggedSetup: heading H = Hc + offset + declination, transceiver from the logged antenna, h = sqrt(max(0, range^2 - (depth - draftM)^2)), geodesic step h along H + b.',
  'surface unit logs the GNSS antenna position and the compass heading Hc; vehicle depth is the pressure-sensor depth.',
];

const TRACK_PLACEHOLDER = '@@track@@';

function column(values: ArrayLike<number>, decimals: number): string {
  const parts = new Array<string>(values.length);
  for (let i = 0; i < values.length; i++) parts[i] = (values[i] as number).toFixed(decimals);
  return `[${parts.join(',')}]`;
}

function stable(value: unknown): string {
  return JSON.stringify(value, (_key, v: unknown) =>
    v !== null && typeof v === 'object' && !Array.isArray(v)
      ? Object.fromEntries(
          Object.entries(v as Record<string, unknown>).sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0)),
        )
      : v,
  );
}

/**
 * Serialises a dive's truth as stable JSON text (sorted keys, fixed decimals, trailing newline):
 * spec summary, true and logged setup, water, the observation conventions, injected faults, the
 * files written for it, the true vehicle and surface tracks as columns (positions 8 decimals,
 * depths and ranges 3, headings 2, times whole ms), and `track.vehicleLogTruthIndex`: for each
 * row of the vehicle log, the index of the true sample it was made from.
 */
export function formatDiveTruth(dive: SimulatedDive, files: readonly SimulatedFile[]): string {
  const { spec, truth } = dive;
  const head = stable({
    diveId: spec.diveId,
    seed: spec.seed,
    site: spec.site,
    startTime: new Date(truth.startTimeMs).toISOString(),
    endTime: new Date(truth.endTimeMs).toISOString(),
    startTimeMs: truth.startTimeMs,
    endTimeMs: truth.endTimeMs,
    sampleIntervalS: truth.sampleIntervalS,
    vehiclePlatform: spec.flight.platform,
    pattern: spec.flight.pattern,
    patternSpeedMps: spec.flight.speedMps,
    launch: spec.flight.launch,
    surfaceUnit: spec.surfaceUnit,
    water: truth.water,
    trueSetup: truth.trueSetup,
    loggedSetup: truth.loggedSetup,
    noise: spec.noise,
    faultModel: spec.faults,
    conventions: OBSERVATION_CONVENTIONS,
    faults: truth.faults,
    files: files.map((f) => ({
      name: f.name,
      role: f.role,
      format: f.format,
      dialect: f.dialect,
      ...(f.timeZone === undefined ? {} : { timeZone: f.timeZone }),
      ...(f.crs === undefined ? {} : { crs: f.crs }),
      rows: f.text.length === 0 ? 0 : f.role === 'surface' ? dive.surfaceLog.length : dive.vehicleLog.length,
    })),
    track: TRACK_PLACEHOLDER,
    counts: {
      samples: truth.vehicle.timeMs.length,
      vehicleFixes: dive.vehicleLog.length,
      surfaceFixes: dive.surfaceLog.length,
    },
  });
  const v = truth.vehicle;
  const s = truth.surface;
  const track =
    `{"surface":{"headingDeg":${column(s.headingDeg, 2)},"latDeg":${column(s.latDeg, 8)},` +
    `"lonDeg":${column(s.lonDeg, 8)},"timeMs":${column(s.timeMs, 0)}},` +
    `"vehicle":{"azimuthDeg":${column(v.azimuthDeg, 2)},"depthM":${column(v.depthM, 3)},"headingDeg":${column(v.headingDeg, 2)},` +
    `"latDeg":${column(v.latDeg, 8)},"lonDeg":${column(v.lonDeg, 8)},"slantRangeM":${column(v.slantRangeM, 3)},` +
    `"timeMs":${column(v.timeMs, 0)}},"vehicleLogTruthIndex":${column(dive.vehicleLog.truthIndex, 0)}}`;
  return `${head.replace(`"${TRACK_PLACEHOLDER}"`, () => track)}\n`;
}
