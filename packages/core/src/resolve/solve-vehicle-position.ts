import { directGeodesic } from '../geodesy/geodesic.js';
import { normaliseAzimuthDeg } from '../model/units.js';

/** Corrected physical quantities for one fix, all already in true (not logged) terms. */
export interface VehiclePositionInput {
  /** GNSS antenna position of the surface unit, WGS 84 degrees. */
  surfaceLatDeg: number;
  surfaceLonDeg: number;
  /** True heading of the surface unit's frame, degrees clockwise from north; may be `NaN` when the lever arm is zero. */
  surfaceHeadingTrueDeg: number;
  /** Antenna to transceiver in the surface unit's frame, metres forward and to starboard (level frame assumed). */
  leverArmForwardM: number;
  leverArmStarboardM: number;
  /** Transceiver depth below the water surface, metres. */
  transceiverDepthM: number;
  /** True slant range from transceiver to vehicle, metres. */
  slantRangeM: number;
  /** True azimuth from transceiver to vehicle, degrees clockwise from north. */
  azimuthDeg: number;
  /** Vehicle depth below the water surface, metres. */
  vehicleDepthM: number;
}

/** Why a fix could not be re-solved. Codes never change meaning once published. */
export type ResolveRejectionReason =
  | 'missing-slant-range'
  | 'invalid-slant-range'
  | 'missing-bearing'
  | 'missing-vehicle-depth'
  | 'missing-surface-position'
  | 'missing-surface-heading'
  | 'vertical-separation-exceeds-slant-range';

/** The outcome for one fix: a position, or a reason it has none. */
export type VehiclePositionResult =
  | {
      ok: true;
      latDeg: number;
      lonDeg: number;
      /** Horizontal range from transceiver to vehicle, metres. */
      horizontalRangeM: number;
      /** Transceiver position after the lever arm, WGS 84 degrees. */
      transceiverLatDeg: number;
      transceiverLonDeg: number;
    }
  | { ok: false; reason: ResolveRejectionReason; message: string };

/**
 * Positions the vehicle from one acoustic observation: horizontal range = √(slant² − Δz²) with
 * Δz = vehicle depth − transceiver depth; the transceiver sits at the lever arm rotated by the
 * surface unit's true heading (a level surface unit: roll and pitch are not modelled); the vehicle
 * lies at that horizontal range along the azimuth, both steps solved as geodesic direct problems
 * on WGS 84. Rejects (as a value, never clamped) a fix whose vertical separation exceeds its slant
 * range, or that lacks a slant range, azimuth, depth, surface position, or the heading a non-zero
 * lever arm needs.
 */
export function solveVehiclePosition(input: VehiclePositionInput): VehiclePositionResult {
  const {
    surfaceLatDeg,
    surfaceLonDeg,
    surfaceHeadingTrueDeg,
    leverArmForwardM,
    leverArmStarboardM,
    transceiverDepthM,
    slantRangeM,
    azimuthDeg,
    vehicleDepthM,
  } = input;
  if (Number.isNaN(slantRangeM)) return reject('missing-slant-range', 'no slant range');
  if (!Number.isFinite(slantRangeM) || slantRangeM < 0)
    return reject('invalid-slant-range', `slant range must be 0 m or more, got ${slantRangeM} m`);
  if (!Number.isFinite(azimuthDeg)) return reject('missing-bearing', 'no bearing to the vehicle');
  if (!Number.isFinite(vehicleDepthM)) return reject('missing-vehicle-depth', 'no vehicle depth');
  if (!Number.isFinite(surfaceLatDeg) || !Number.isFinite(surfaceLonDeg))
    return reject('missing-surface-position', 'no surface unit position');
  const hasLeverArm = leverArmForwardM !== 0 || leverArmStarboardM !== 0;
  if (hasLeverArm && !Number.isFinite(surfaceHeadingTrueDeg))
    return reject('missing-surface-heading', 'no surface unit heading to turn the lever arm with');

  const verticalM = vehicleDepthM - transceiverDepthM;
  if (Math.abs(verticalM) > slantRangeM)
    return reject(
      'vertical-separation-exceeds-slant-range',
      `vertical separation ${Math.abs(verticalM).toFixed(3)} m exceeds slant range ${slantRangeM.toFixed(3)} m`,
    );
  const horizontalRangeM = Math.sqrt(slantRangeM * slantRangeM - verticalM * verticalM);

  let transceiverLatDeg = surfaceLatDeg;
  let transceiverLonDeg = surfaceLonDeg;
  if (hasLeverArm) {
    const h = (surfaceHeadingTrueDeg * Math.PI) / 180;
    const northM = leverArmForwardM * Math.cos(h) - leverArmStarboardM * Math.sin(h);
    const eastM = leverArmForwardM * Math.sin(h) + leverArmStarboardM * Math.cos(h);
    const offset = directGeodesic(
      surfaceLatDeg,
      surfaceLonDeg,
      (Math.atan2(eastM, northM) * 180) / Math.PI,
      Math.hypot(northM, eastM),
    );
    transceiverLatDeg = offset.latDeg;
    transceiverLonDeg = offset.lonDeg;
  }
  const vehicle =
    horizontalRangeM === 0
      ? { latDeg: transceiverLatDeg, lonDeg: transceiverLonDeg }
      : directGeodesic(transceiverLatDeg, transceiverLonDeg, normaliseAzimuthDeg(azimuthDeg), horizontalRangeM);
  return {
    ok: true,
    latDeg: vehicle.latDeg,
    lonDeg: vehicle.lonDeg,
    horizontalRangeM,
    transceiverLatDeg,
    transceiverLonDeg,
  };
}

function reject(reason: ResolveRejectionReason, message: string): VehiclePositionResult {
  return { ok: false, reason, message };
}
