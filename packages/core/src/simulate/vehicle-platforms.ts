/** The kinds of vehicle the simulator flies. */
export type VehiclePlatformName = 'inspection-rov' | 'work-rov' | 'diver';

/**
 * A vehicle's stated limits. The simulator never exceeds them (pattern speeds stay at or below
 * 80 % of the limits), so an audit with the same limits should find no speed fault on clean fixes.
 */
export interface VehiclePlatform {
  name: VehiclePlatformName;
  /** Horizontal speed limit, m/s. */
  maxSpeedMps: number;
  /** Vertical speed limit (descent and ascent), m/s. */
  maxVerticalSpeedMps: number;
  /** Heading rate limit, degrees per second. */
  maxTurnRateDegPerS: number;
  /** Tether or umbilical length: the farthest slant range from the transceiver, metres. */
  tetherLengthM: number;
  /** Deepest rated depth, metres. */
  maxDepthM: number;
}

/**
 * Stated limits of the simulated vehicles (common practice for small inspection ROVs, work-class
 * ROVs and surface-supplied divers; not any maker's figures).
 */
export const VEHICLE_PLATFORMS: Readonly<Record<VehiclePlatformName, VehiclePlatform>> = {
  'inspection-rov': {
    name: 'inspection-rov',
    maxSpeedMps: 1.5,
    maxVerticalSpeedMps: 0.5,
    maxTurnRateDegPerS: 45,
    tetherLengthM: 300,
    maxDepthM: 300,
  },
  'work-rov': {
    name: 'work-rov',
    maxSpeedMps: 1.5,
    maxVerticalSpeedMps: 0.75,
    maxTurnRateDegPerS: 30,
    tetherLengthM: 600,
    maxDepthM: 1000,
  },
  diver: {
    name: 'diver',
    maxSpeedMps: 0.6,
    // Common practice: ascend no faster than about 9–10 m/min.
    maxVerticalSpeedMps: 0.25,
    maxTurnRateDegPerS: 60,
    tetherLengthM: 60,
    maxDepthM: 50,
  },
};
