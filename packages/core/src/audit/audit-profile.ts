/**
 * Audit profiles: every threshold a check compares with, per kind of platform. Each preset value
 * says where it comes from: "common practice" marks a manufacturer-neutral rule of thumb of the
 * trade, a standard is named where one applies. The full table with reasons is in
 * packages/core/src/audit/README.md.
 */

/** How the system's 95 % horizontal and vertical uncertainty is estimated per fix. */
export interface UncertaintyModel {
  /** USBL stated accuracy as a fraction of slant range at 95 % (0.01 = 1 % of slant range). */
  usblRangeFraction: number;
  /** USBL accuracy floor at 95 %, metres, added to the range term. */
  usblFloorM: number;
  /** Surface unit GNSS horizontal accuracy at 95 %, metres. */
  gnssHorizontal95M: number;
  /** Heading (and bearing reference) accuracy at 95 %, degrees. */
  heading95Deg: number;
  /** Depth sensor accuracy at 95 %: floor in metres plus a fraction of depth. */
  depthFloorM: number;
  depthFraction: number;
}

/** Every threshold of every check, plus the dive-splitting and smoothing settings of one platform. */
export interface AuditProfile {
  name: string;
  description: string;
  /** A gap longer than this many times the log's typical fix interval is an `info` finding. */
  gapFactor: number;
  /** A gap between consecutive fixes longer than this is a `warn` finding, seconds. */
  gapWarnS: number;
  /** ... and longer than this a `fail` finding, seconds. */
  gapFailS: number;
  /** Fix rate below this over a window is a finding, fixes per second. */
  minFixRateHz: number;
  /** Length of the window the fix rate is judged over, seconds. */
  fixRateWindowS: number;
  /** Highest believable horizontal speed, m/s. */
  maxSpeedMps: number;
  /** Highest believable horizontal acceleration, m/s². */
  maxAccelerationMps2: number;
  /** Time base over which speed and acceleration are measured between robust local positions, seconds. */
  speedBaselineS: number;
  /** Highest believable vertical speed, m/s. */
  maxVerticalSpeedMps: number;
  /** A fix must stand off its neighbours' median by more than this to be a position jump, metres. */
  jumpFloorM: number;
  /** ... and by more than this many times the local spread of its neighbours. */
  jumpSpreadFactor: number;
  /** A depth must stand off its neighbours' median by more than this to be a depth jump, metres. */
  depthJumpFloorM: number;
  /** Farthest a vehicle can be from the surface unit (acoustic range or tether length), metres. */
  maxRangeM: number;
  /** A stationary surface unit moving farther than this from its median position is a `warn`, metres. */
  surfaceDriftWarnM: number;
  /** ... and farther than this a `fail`, metres. */
  surfaceDriftFailM: number;
  /** Acceptable transceiver draft below the water surface, metres. */
  draftMinM: number;
  draftMaxM: number;
  /** A depth shallower than minus this (above the water) is flagged, metres. */
  aboveSurfaceToleranceM: number;
  /** Share of fixes flagged by one check above which its findings become `fail` (0–1). */
  flaggedShareFail: number;
  uncertainty: UncertaintyModel;
  /** Dive splitting: a gap longer than this ends a dive, seconds. */
  splitGapS: number;
  /** Dive splitting: a vehicle shallower than this is at the surface, metres. */
  surfaceDepthM: number;
  /** Dive splitting: a stay at the surface longer than this ends a dive, seconds. */
  surfaceIntervalS: number;
  /**
   * Smoothing: standard deviation of the vehicle's unmodelled acceleration, m/s². About half the
   * platform's acceleration in its tightest usual turns (common practice for tuning a
   * constant-velocity filter: too small lags in turns, too large passes the noise through).
   */
  smoothingAccelerationMps2: number;
}

/** The names of the built-in profiles. */
export type PresetProfileName = 'inspection-rov' | 'work-rov' | 'diver' | 'towed-body';

// Values shared by every preset unless a preset says otherwise, all common practice:
// - gaps: five missed updates in a row (5x the log's own interval) are worth noting; a USBL
//   normally delivers a fix every 1-2 s, so 20 s without one needs a look and 2 min means the
//   vehicle track between them is guesswork.
// - fix rate: fewer than one fix per 5 s over a minute (0.2 Hz) is a weak acoustic link.
// - position jumps: 5x the local spread (the median residual, about 1.18 Rayleigh sigmas) puts the
//   limit near 6 sigmas, so Gaussian noise alone would cross it about once in 10^7 fixes; the
//   margin absorbs the wobble of a 32-sample scale estimate (the Hampel identifier's usual 3-4
//   sigma flags too much at a million fixes). The floor stops sub-metre wobble of pre-filtered
//   logs counting as jumps.
// - surface drift: standalone/SBAS GNSS wanders 2-3 m (95 %), so 5 m from the median is real
//   movement and 20 m is a vessel off station.
// - draft: a transceiver about 1-1.5 m below the surface, clear of hull and objects (common
//   practice; shallower suffers from aeration and surface noise).
// - above surface: pressure sensors read +-0.5 m at the surface (offset, waves, atmospheric pressure).
// - uncertainty: GNSS 2 m at 95 % (SBAS-corrected single receiver), heading 0.5 deg at 95 %
//   (GNSS or gyro compass), depth sensor 0.1 m + 0.1 % of depth (typical strain-gauge sensor).
const COMMON = {
  gapFactor: 5,
  gapWarnS: 20,
  gapFailS: 120,
  minFixRateHz: 0.2,
  fixRateWindowS: 60,
  speedBaselineS: 10,
  jumpSpreadFactor: 5,
  surfaceDriftWarnM: 5,
  surfaceDriftFailM: 20,
  draftMinM: 1,
  draftMaxM: 1.5,
  aboveSurfaceToleranceM: 0.5,
  flaggedShareFail: 0.05,
  splitGapS: 900,
  surfaceDepthM: 1,
  surfaceIntervalS: 300,
} as const;

const COMMON_UNCERTAINTY = { gnssHorizontal95M: 2, heading95Deg: 0.5, depthFloorM: 0.1, depthFraction: 0.001 } as const;

/** The built-in profiles; every value is a common-practice rule of thumb (see the comments and the audit README). */
export const PRESET_PROFILES: Readonly<Record<PresetProfileName, AuditProfile>> = {
  // Small electric observation/inspection vehicles: 1-1.5 m/s flat out (2-3 kn), tethers of
  // 150-300 m, compact USBL systems quoting about 1 % of slant range.
  'inspection-rov': {
    ...COMMON,
    name: 'inspection-rov',
    description: 'Inspection-class ROV (small electric vehicle, tether up to about 300 m)',
    maxSpeedMps: 2,
    maxAccelerationMps2: 1,
    maxVerticalSpeedMps: 1,
    jumpFloorM: 2,
    depthJumpFloorM: 1,
    maxRangeM: 400,
    uncertainty: { ...COMMON_UNCERTAINTY, usblRangeFraction: 0.01, usblFloorM: 0.2 },
    smoothingAccelerationMps2: 0.5,
  },
  // Heavy hydraulic vehicles: rarely above 1.5 m/s (3 kn), sluggish (0.5 m/s²), work from a tether
  // management system to 1-3 km, positioned by higher-grade USBL (about 0.25 % of slant range).
  'work-rov': {
    ...COMMON,
    name: 'work-rov',
    description: 'Work-class ROV (hydraulic vehicle, tether management system, long range)',
    maxSpeedMps: 2,
    maxAccelerationMps2: 0.5,
    maxVerticalSpeedMps: 1.5,
    jumpFloorM: 3,
    depthJumpFloorM: 1.5,
    maxRangeM: 3000,
    uncertainty: { ...COMMON_UNCERTAINTY, usblRangeFraction: 0.0025, usblFloorM: 0.1 },
    smoothingAccelerationMps2: 0.25,
  },
  // Divers: sustained swimming 0.3-0.7 m/s, a sprint about 1 m/s; ascent 9-18 m/min (0.15-0.3 m/s)
  // is what training agencies teach, free descent up to about 1 m/s; a diver transponder often
  // pings every 2-4 s, so a 0.1 Hz floor; umbilicals and diver-tracking ranges to about 300 m.
  diver: {
    ...COMMON,
    name: 'diver',
    description: 'Diver with a transponder (scuba or surface-supplied)',
    gapWarnS: 30,
    gapFailS: 180,
    minFixRateHz: 0.1,
    maxSpeedMps: 1.2,
    maxAccelerationMps2: 0.5,
    maxVerticalSpeedMps: 1,
    jumpFloorM: 2,
    depthJumpFloorM: 1,
    maxRangeM: 300,
    uncertainty: { ...COMMON_UNCERTAINTY, usblRangeFraction: 0.01, usblFloorM: 0.3 },
    smoothingAccelerationMps2: 0.25,
  },
  // Towed bodies (camera sleds, sonars): towed at 1-2.5 m/s (2-5 kn), top about 3.5 m/s; they
  // cannot stop or turn quickly (0.3 m/s²); cables of up to about 2 km.
  'towed-body': {
    ...COMMON,
    name: 'towed-body',
    description: 'Towed body (sled, sonar or camera frame on a tow cable)',
    maxSpeedMps: 3.5,
    maxAccelerationMps2: 0.3,
    maxVerticalSpeedMps: 1.5,
    jumpFloorM: 3,
    depthJumpFloorM: 1.5,
    maxRangeM: 2000,
    uncertainty: { ...COMMON_UNCERTAINTY, usblRangeFraction: 0.005, usblFloorM: 0.2 },
    smoothingAccelerationMps2: 0.15,
  },
};

/** Whether a name is one of the built-in profiles. */
export function isPresetProfileName(name: string): name is PresetProfileName {
  return Object.hasOwn(PRESET_PROFILES, name);
}
