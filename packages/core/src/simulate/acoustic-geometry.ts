/**
 * The acoustic geometry of a USBL surface unit and a vehicle, forward (what the system observes)
 * and back (what a topside computes from the observation). The simulator uses both; re-solving
 * inverts exactly this contract, so it is stated once here.
 *
 * Conventions (every angle in degrees clockwise from true north unless said otherwise):
 * - Surface-unit frame: forward along the unit's reference axis (a boat's bow), starboard to the
 *   right, down. Its true heading `H` is the true azimuth of the forward axis; the transceiver's
 *   bearing zero is that same axis.
 * - Compass: the logged heading is `Hc = H − declination − installationOffset`. Declination is
 *   east-positive (magnetic north east of true north). So a topside recovers
 *   `H = Hc + installationOffset + declination`.
 * - Lever arm `(forwardM, starboardM, downM)` from the GNSS antenna to the transceiver in the
 *   surface-unit frame. Horizontally the transceiver sits `forwardM·(sin H, cos H) +
 *   starboardM·(cos H, −sin H)` metres (east, north) from the antenna, reached with one geodesic
 *   step on WGS 84 from the antenna. Vertically the transceiver is at `draftM` below the sea
 *   surface; `downM` does not enter the geometry (the antenna's height above the water line is not
 *   modelled), it is carried in the setup for completeness.
 * - True slant range `R = √(h² + v²)`, with `h` the WGS 84 geodesic distance from the transceiver
 *   to the vehicle and `v = vehicleDepthM − draftM`; the true azimuth `A` is the geodesic's
 *   forward azimuth at the transceiver.
 * - Logged slant range `R_log = R · assumedSoundSpeedMps / waterSoundSpeedMps` (the system times
 *   the echo in the real water and converts with the speed it was told).
 * - Logged bearing `b = A − H` wrapped into [0, 360): relative to the unit's forward axis. Hence
 *   `A = Hc + installationOffset + declination + b`.
 * - Vehicle depth comes from the vehicle's own pressure sensor and is not acoustic.
 * - A topside fix: `H' = Hc + offset' + declination'`, the transceiver from the logged antenna
 *   with the logged lever arm and `H'`, `h' = √max(0, R_log² − (depth − draft')²)`, and the vehicle
 *   one geodesic step of `h'` along `H' + b` from that transceiver.
 */
import { directGeodesic, inverseGeodesic } from '../geodesy/geodesic.js';
import { normaliseAzimuthDeg } from '../model/units.js';

/** The GNSS-antenna-to-transceiver offset in the surface-unit frame, metres. */
export interface LeverArm {
  forwardM: number;
  starboardM: number;
  /** Kept for completeness; the transceiver's depth is `draftM` (see the module's conventions). */
  downM: number;
}

/**
 * The settings that turn an acoustic observation into a position. As the *true* setup,
 * `soundSpeedMps` is the water's own speed; as the *logged* setup, it is the speed the system
 * assumed (1500 m/s by default).
 */
export interface AcousticSetup {
  soundSpeedMps: number;
  /** Magnetic declination, degrees, east positive. */
  declinationDeg: number;
  /** Transceiver bearing zero relative to the compass's zero, degrees clockwise. */
  installationOffsetDeg: number;
  leverArm: LeverArm;
  /** Transceiver depth below the sea surface, metres. */
  draftM: number;
}

/** What the system observes of one vehicle position, noise-free. */
export interface AcousticObservation {
  /** The compass heading the surface unit logs, degrees in [0, 360). */
  compassHeadingDeg: number;
  transceiverLatDeg: number;
  transceiverLonDeg: number;
  /** Geodesic distance transceiver → vehicle, metres. */
  horizontalRangeM: number;
  /** True azimuth from the transceiver to the vehicle, degrees in [0, 360). */
  trueAzimuthDeg: number;
  trueSlantRangeM: number;
  /** The slant range as logged with the assumed sound speed, metres. */
  loggedSlantRangeM: number;
  /** The bearing as logged: relative to the surface unit's forward axis, degrees in [0, 360). */
  relativeBearingDeg: number;
}

/** Horizontal position of the transceiver: one geodesic step from the antenna along the rotated lever arm. */
export function locateTransceiver(
  antennaLatDeg: number,
  antennaLonDeg: number,
  trueHeadingDeg: number,
  leverArm: LeverArm,
): { latDeg: number; lonDeg: number } {
  const { forwardM, starboardM } = leverArm;
  if (forwardM === 0 && starboardM === 0) return { latDeg: antennaLatDeg, lonDeg: antennaLonDeg };
  const headingRad = (trueHeadingDeg * Math.PI) / 180;
  const sin = Math.sin(headingRad);
  const cos = Math.cos(headingRad);
  const eastM = forwardM * sin + starboardM * cos;
  const northM = forwardM * cos - starboardM * sin;
  const azimuthDeg = (Math.atan2(eastM, northM) * 180) / Math.PI;
  const end = directGeodesic(antennaLatDeg, antennaLonDeg, azimuthDeg, Math.hypot(eastM, northM));
  return { latDeg: end.latDeg, lonDeg: end.lonDeg };
}

/**
 * The noise-free observation of a vehicle at (`vehicleLatDeg`, `vehicleLonDeg`, `vehicleDepthM`)
 * from a surface unit whose GNSS antenna is at (`antennaLatDeg`, `antennaLonDeg`) with true heading
 * `trueHeadingDeg`, in water with the true setup, logged with `assumedSoundSpeedMps`. Follows the
 * module's conventions exactly; degrees, metres, m/s.
 */
export function observeVehicle(
  antennaLatDeg: number,
  antennaLonDeg: number,
  trueHeadingDeg: number,
  vehicleLatDeg: number,
  vehicleLonDeg: number,
  vehicleDepthM: number,
  trueSetup: AcousticSetup,
  assumedSoundSpeedMps: number,
): AcousticObservation {
  const transceiver = locateTransceiver(antennaLatDeg, antennaLonDeg, trueHeadingDeg, trueSetup.leverArm);
  const inverse = inverseGeodesic(transceiver.latDeg, transceiver.lonDeg, vehicleLatDeg, vehicleLonDeg);
  const verticalM = vehicleDepthM - trueSetup.draftM;
  const trueSlantRangeM = Math.hypot(inverse.distanceM, verticalM);
  // Coincident points give GeographicLib's azimuth; any direction is then equally right.
  const trueAzimuthDeg = inverse.distanceM === 0 ? 0 : inverse.azimuth1Deg;
  return {
    compassHeadingDeg: normaliseAzimuthDeg(trueHeadingDeg - trueSetup.declinationDeg - trueSetup.installationOffsetDeg),
    transceiverLatDeg: transceiver.latDeg,
    transceiverLonDeg: transceiver.lonDeg,
    horizontalRangeM: inverse.distanceM,
    trueAzimuthDeg,
    trueSlantRangeM,
    loggedSlantRangeM: (trueSlantRangeM * assumedSoundSpeedMps) / trueSetup.soundSpeedMps,
    relativeBearingDeg: normaliseAzimuthDeg(trueAzimuthDeg - trueHeadingDeg),
  };
}

/** A vehicle position as a topside computes it from one observation. */
export interface TopsideFix {
  latDeg: number;
  lonDeg: number;
  /** Horizontal range used, metres; 0 when the slant range was shorter than the depth difference. */
  horizontalRangeM: number;
  /** True when `slantRangeM < |depth − draft|`, so the horizontal range was clamped to 0. */
  rangeShorterThanDepth: boolean;
}

/**
 * Computes the vehicle's position the way a topside does, from the logged antenna position and
 * compass heading, the logged slant range (m), relative bearing (deg) and vehicle depth (m), with
 * the `setup` the topside was given (its `soundSpeedMps` is the speed the range was logged with,
 * so ranges are used as they are). The exact inverse of `observeVehicle` when the setups agree.
 */
export function solveTopsideFix(
  antennaLatDeg: number,
  antennaLonDeg: number,
  compassHeadingDeg: number,
  slantRangeM: number,
  relativeBearingDeg: number,
  vehicleDepthM: number,
  setup: AcousticSetup,
): TopsideFix {
  const headingDeg = compassHeadingDeg + setup.installationOffsetDeg + setup.declinationDeg;
  const transceiver = locateTransceiver(antennaLatDeg, antennaLonDeg, headingDeg, setup.leverArm);
  const verticalM = vehicleDepthM - setup.draftM;
  const squared = slantRangeM * slantRangeM - verticalM * verticalM;
  const horizontalRangeM = squared > 0 ? Math.sqrt(squared) : 0;
  if (horizontalRangeM === 0) {
    return { ...transceiver, horizontalRangeM, rangeShorterThanDepth: squared < 0 };
  }
  const end = directGeodesic(transceiver.latDeg, transceiver.lonDeg, headingDeg + relativeBearingDeg, horizontalRangeM);
  return { latDeg: end.latDeg, lonDeg: end.lonDeg, horizontalRangeM, rangeShorterThanDepth: false };
}
