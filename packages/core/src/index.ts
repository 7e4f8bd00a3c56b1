export type { ConvertToWgs84Result } from './crs/convert-to-wgs84.js';
export { convertToWgs84 } from './crs/convert-to-wgs84.js';
export type { ReprojectedColumns, Reprojection } from './crs/create-reprojection.js';
export { createReprojection } from './crs/create-reprojection.js';
export type { CrsMethod, ResolveCrsOptions, ResolvedCrs } from './crs/resolve-crs.js';
export { parseCrsCode, resolveCrs } from './crs/resolve-crs.js';
export { InvalidArgumentError, LeadlineError, UnreadableInputError } from './errors.js';
export type { LocalFrame } from './geodesy/create-local-frame.js';
export { createLocalFrame } from './geodesy/create-local-frame.js';
export type { DirectGeodesicResult, GeodesicPolygonAreaResult, InverseGeodesicResult } from './geodesy/geodesic.js';
export {
  directGeodesic,
  geodesicDistanceM,
  geodesicPolygonArea,
  inverseGeodesic,
} from './geodesy/geodesic.js';
export type { Rejection, RejectionCode } from './model/rejection.js';
export { formatRejection } from './model/rejection.js';
export type {
  BearingReference,
  DepthSignDecision,
  Fix,
  FixColumnName,
  FixColumns,
  LogFormat,
  Provenance,
  Track,
  TrackRole,
  Waypoint,
} from './model/track.js';
export { createFixColumns, FIX_COLUMN_NAMES, getFix, hasColumnValues } from './model/track.js';
export { TrackBuilder } from './model/track-builder.js';
export type { LengthUnit, SpeedUnit } from './model/units.js';
export {
  degToRad,
  fromMetres,
  fromMetresPerSecond,
  METRES_PER_FATHOM,
  METRES_PER_FOOT,
  METRES_PER_NAUTICAL_MILE,
  METRES_PER_US_SURVEY_FOOT,
  MPS_PER_KNOT,
  normaliseAzimuthDeg,
  normaliseLongitudeDeg,
  parseLengthUnit,
  parseSpeedUnit,
  radToDeg,
  toMetres,
  toMetresPerSecond,
} from './model/units.js';
export type { PathSoundSpeed } from './resolve/create-path-sound-speed.js';
export { createPathSoundSpeed } from './resolve/create-path-sound-speed.js';
export type { ResolveReport } from './resolve/format-resolve-result.js';
export { formatResolveResult } from './resolve/format-resolve-result.js';
export type { MagneticDeclination } from './resolve/magnetic-declination.js';
export { decimalYearFromTimeMs, magneticDeclination } from './resolve/magnetic-declination.js';
export type { ResolveSetup, ResolveSetupInput, WaterSoundSpeed } from './resolve/resolve-setup.js';
export { parseResolveSetup, resolveSetupSchema } from './resolve/resolve-setup.js';
export type {
  AppliedSetup,
  AuditOutcome,
  ResolveComparison,
  ResolvedProvenance,
  ResolveRejection,
  ResolveResult,
  ResolveTrackOptions,
} from './resolve/resolve-track.js';
export { resolveTrack } from './resolve/resolve-track.js';
export type {
  ResolveRejectionReason,
  VehiclePositionInput,
  VehiclePositionResult,
} from './resolve/solve-vehicle-position.js';
export { solveVehiclePosition } from './resolve/solve-vehicle-position.js';
export type { SoundSpeedSample, TemperatureScale, Unesco1983Options } from './resolve/sound-speed.js';
export {
  depthFromPressureUnesco1983,
  harmonicMeanSoundSpeed,
  pressureFromDepthUnesco1983,
  soundSpeedFreshBilaniukWong1993,
  soundSpeedFreshMarczak1997,
  soundSpeedMackenzie1981,
  soundSpeedUnesco1983,
  soundSpeedUnesco1983AtDepth,
} from './resolve/sound-speed.js';
export type { MovementSummary } from './resolve/summarise-movement.js';
export { summariseMovement } from './resolve/summarise-movement.js';
export { LEADLINE_VERSION } from './version.js';
