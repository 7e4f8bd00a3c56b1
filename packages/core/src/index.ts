export type { AuditProfile, PresetProfileName, UncertaintyModel } from './audit/audit-profile.js';
export { isPresetProfileName, PRESET_PROFILES } from './audit/audit-profile.js';
export type { AuditSetup } from './audit/audit-setup.js';
export type { AuditOptions, AuditResult } from './audit/audit-track.js';
export { auditTrack } from './audit/audit-track.js';
export { compareSeverity, decideVerdict } from './audit/decide-verdict.js';
export type { FixUncertainty, S44Share } from './audit/estimate-uncertainty.js';
export { shareMeetingS44Orders } from './audit/estimate-uncertainty.js';
export type { CheckName, Finding, Severity, Verdict } from './audit/finding.js';
export { parseAuditSetup } from './audit/parse-audit-setup.js';
export { AuditProfileSchema, parseUserProfiles } from './audit/parse-user-profiles.js';
export { resolveAuditProfile } from './audit/resolve-audit-profile.js';
export type { S44Order, S44OrderLimits } from './audit/s44-orders.js';
export { maximumThuM, maximumTvuM, S44_ORDERS } from './audit/s44-orders.js';
export type { SimulatedDiveScore } from './audit/score-simulated-dive.js';
export { AUDITABLE_FAULT_KINDS, scoreSimulatedDive, trackFromSimulatedDive } from './audit/score-simulated-dive.js';
export { dropFlaggedFixes } from './clean/drop-flagged-fixes.js';
export type { ResampleOptions } from './clean/resample-track.js';
export { resampleTrack } from './clean/resample-track.js';
export type { SmoothOptions, SmoothResult } from './clean/smooth-track.js';
export { smoothTrack } from './clean/smooth-track.js';
export type { DivePart, FixSpan, SplitOptions, SplitResult } from './clean/split-dives.js';
export { splitDives } from './clean/split-dives.js';
export { takeFixes } from './clean/take-fixes.js';
export type { UtmChoice } from './crs/choose-utm-zone.js';
export { chooseUtmZone, utmZoneOf } from './crs/choose-utm-zone.js';
export type { ConvertToWgs84Result } from './crs/convert-to-wgs84.js';
export { convertToWgs84 } from './crs/convert-to-wgs84.js';
export type { ReprojectedColumns, Reprojection } from './crs/create-reprojection.js';
export { createReprojection } from './crs/create-reprojection.js';
export type { CrsMethod, ResolveCrsOptions, ResolvedCrs } from './crs/resolve-crs.js';
export { parseCrsCode, resolveCrs } from './crs/resolve-crs.js';
export type { CrsListing } from './crs/search-crs.js';
export { findCrsAt, searchCrs } from './crs/search-crs.js';
export { InvalidArgumentError, LeadlineError, UnreadableInputError } from './errors.js';
export type { SurfaceRange, SurfaceRangeOptions } from './geodesy/compute-surface-range.js';
export { computeSurfaceRange } from './geodesy/compute-surface-range.js';
export type { LocalFrame } from './geodesy/create-local-frame.js';
export { createLocalFrame } from './geodesy/create-local-frame.js';
export type { DirectGeodesicResult, GeodesicPolygonAreaResult, InverseGeodesicResult } from './geodesy/geodesic.js';
export {
  directGeodesic,
  geodesicDistanceM,
  geodesicPolygonArea,
  inverseGeodesic,
} from './geodesy/geodesic.js';
export type { BoundingBox, MeasureTrackOptions, SpeedCourse, TrackLength } from './geodesy/measure-track.js';
export {
  computeBoundingBox,
  computeCentroid,
  computeSegmentDistances,
  computeSpeedAndCourse,
  measureTrackLength,
} from './geodesy/measure-track.js';
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
export { createFixColumns, FIX_COLUMN_NAMES, getFix, hasColumnValues, joinColumns } from './model/track.js';
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
export type { DecodedLogText } from './read/decode-log-text.js';
export { decodeLogChunks, decodeLogText } from './read/decode-log-text.js';
export type { ColumnKey, ColumnReportEntry, LogInput, LogReadResult, ReadOptions } from './read/log-read-result.js';
export type { CsvColumnMap, MappedColumn, TimeForm } from './read/map-csv-columns.js';
export { guessColumnFromName, mapCsvColumns } from './read/map-csv-columns.js';
export type { CoordinateAxis, CoordinateForm, ParsedCoordinate } from './read/parse-coordinate.js';
export { parseCoordinate } from './read/parse-coordinate.js';
export type { ParsedTime } from './read/parse-log-time.js';
export { EARLIEST_TIME_MS, LATEST_TIME_MS, LogTimeParser } from './read/parse-log-time.js';
export type { CsvLayout, LogTextInput } from './read/read-csv.js';
export { detectDelimiter, readCsv, readCsvEvents, splitCsvRecord } from './read/read-csv.js';
export type { FixBatch, ReadEvent } from './read/read-event.js';
export { readGeoJson, readGeoJsonEvents } from './read/read-geojson.js';
export { readGpx, readGpxEvents } from './read/read-gpx.js';
export { readKml } from './read/read-kml.js';
export { detectFormat, readLog, readLogAndValidate } from './read/read-log.js';
export { computeNmeaChecksum, readNmea, readNmeaEvents } from './read/read-nmea.js';
export type { LogLine } from './read/split-log-lines.js';
export { iterateLogLines, LogLineCursor, MAX_LINE_CHARS, splitLogLines } from './read/split-log-lines.js';
export type { GpxSchemaMessage, GpxValidation } from './read/validate-gpx.js';
export { validateGpx } from './read/validate-gpx.js';
export type { BatchDiveLine, BatchReport } from './report/build-batch-report.js';
export { buildBatchReport } from './report/build-batch-report.js';
export type { DiveReport, DiveReportInput, ReportFinding } from './report/build-dive-report.js';
export { buildDiveReport, VERDICT_RULE } from './report/build-dive-report.js';
export type { ReportPlot } from './report/build-report-plot.js';
export { buildReportPlot } from './report/build-report-plot.js';
export { formatBatchReportHtml, formatDiveReportHtml } from './report/format-report-html.js';
export { formatReportJson } from './report/format-report-json.js';
export { formatBatchReportMarkdown, formatDiveReportMarkdown } from './report/format-report-markdown.js';
export { BatchReportSchema, DiveReportSchema } from './report/report-schemas.js';
export { SAFETY_CAUTION } from './report/safety-caution.js';
export type { PathSoundSpeed } from './resolve/create-path-sound-speed.js';
export { createPathSoundSpeed } from './resolve/create-path-sound-speed.js';
export type { ResolveReport } from './resolve/format-resolve-result.js';
export { formatResolveResult } from './resolve/format-resolve-result.js';
export type { MagneticDeclination } from './resolve/magnetic-declination.js';
export { decimalYearFromTimeMs, magneticDeclination } from './resolve/magnetic-declination.js';
export type { ResolveSetup, ResolveSetupInput, WaterSoundSpeed } from './resolve/resolve-setup.js';
export { parseResolveSetup, resolveSetupJsonSchema, resolveSetupSchema } from './resolve/resolve-setup.js';
export type {
  AppliedSetup,
  AuditOutcome,
  ResolveComparison,
  ResolvedProvenance,
  ResolveRejection,
  ResolveResult,
  ResolveTrackOptions,
} from './resolve/resolve-track.js';
export { bearingReferenceFromHeader, resolveTrack } from './resolve/resolve-track.js';
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
export type { AcousticObservation, AcousticSetup, LeverArm, TopsideFix } from './simulate/acoustic-geometry.js';
export { locateTransceiver, observeVehicle, solveTopsideFix } from './simulate/acoustic-geometry.js';
export type { RandomSource } from './simulate/create-random-source.js';
export { createRandomSource, deriveSeed } from './simulate/create-random-source.js';
export { formatDiveTruth, OBSERVATION_CONVENTIONS } from './simulate/format-dive-truth.js';
export type {
  LocalPoint,
  VehicleFlightPlan,
  VehiclePathSamples,
  VehiclePattern,
} from './simulate/sample-vehicle-path.js';
export { sampleVehiclePath } from './simulate/sample-vehicle-path.js';
export type {
  DiveSpec,
  DiveTruth,
  FaultModel,
  InjectedFault,
  InjectedFaultKind,
  NoiseModel,
  SimulatedDive,
  SimulatedSite,
  SimulatedSurfaceLog,
  SimulatedVehicleLog,
  SurfaceUnitPlan,
} from './simulate/simulate-dive.js';
export { simulateDive } from './simulate/simulate-dive.js';
export type { DemoSite, PlannedDive, SeasonDive, SeasonOptions } from './simulate/simulate-season.js';
export { DEMO_SITES, planSeason, simulatePlannedDive, simulateSeason } from './simulate/simulate-season.js';
export type { VehiclePlatform, VehiclePlatformName } from './simulate/vehicle-platforms.js';
export { VEHICLE_PLATFORMS } from './simulate/vehicle-platforms.js';
export type { LogDialect, SimulatedFile } from './simulate/write-dive-logs.js';
export { diveFileBase, LOG_DIALECTS, writeDiveLogs } from './simulate/write-dive-logs.js';
export type { DiveSummary, SummariseDiveOptions, SummaryPosition } from './summarise/summarise-dive.js';
export { summariseDive } from './summarise/summarise-dive.js';
export { LEADLINE_VERSION } from './version.js';
export type { WriteCsvOptions } from './write/write-csv.js';
export { writeCsv, writeCsvBytes } from './write/write-csv.js';
export type { GeoJsonArea, WriteGeoJsonOptions } from './write/write-geojson.js';
export { GEOJSON_MEDIA_TYPE, writeGeoJson, writeGeoJsonBytes } from './write/write-geojson.js';
export type { WriteGpxOptions } from './write/write-gpx.js';
export { LEADLINE_GPX_NAMESPACE, writeGpx } from './write/write-gpx.js';
export type { WriteInput } from './write/write-input.js';
export { withSurfaceTracks } from './write/write-input.js';
export type { WriteKmlOptions } from './write/write-kml.js';
export { KML_MEDIA_TYPE, writeKml } from './write/write-kml.js';
