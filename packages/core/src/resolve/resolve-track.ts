import type { AuditProfile } from '../audit/audit-profile.js';
import type { AuditSetup } from '../audit/audit-setup.js';
import { auditTrack } from '../audit/audit-track.js';
import type { Verdict } from '../audit/finding.js';
import { InvalidArgumentError } from '../errors.js';
import { geodesicDistanceM } from '../geodesy/geodesic.js';
import type { BearingReference, Provenance, Track } from '../model/track.js';
import { getFix } from '../model/track.js';
import { TrackBuilder } from '../model/track-builder.js';
import { normaliseAzimuthDeg, normaliseLongitudeDeg } from '../model/units.js';
import { createPathSoundSpeed } from './create-path-sound-speed.js';
import { magneticDeclination } from './magnetic-declination.js';
import { parseResolveSetup, type ResolveSetup } from './resolve-setup.js';
import { type ResolveRejectionReason, solveVehiclePosition } from './solve-vehicle-position.js';
import { type MovementSummary, summariseMovement } from './summarise-movement.js';

/** A fix the re-solve could not position, with where it came from and why. */
export interface ResolveRejection {
  /** Index of the fix in the input track. */
  index: number;
  /** 1-based source line, 0 when unknown. */
  line: number;
  timeMs: number;
  reason: ResolveRejectionReason;
  message: string;
}

/** Provenance of a re-solved track: the input's, plus the setup it was re-solved with. */
export type ResolvedProvenance = Provenance & { resolveSetup: ResolveSetup; resolvedFrom: string };

/** The values the re-solve actually used where the setup asked for them to be derived. */
export interface AppliedSetup {
  /** The bearing reference used after `from-log` was looked up. */
  bearingReference: Exclude<BearingReference, 'unknown'>;
  /** Where it came from: the setup, the log's own statement, or the bearing column's name. */
  bearingReferenceFrom: 'setup' | 'log' | 'column-name';
  /** Declination added to logged headings, degrees east. */
  declinationDeg: number;
  /** When the declination came from the World Magnetic Model: where and when it was evaluated. */
  declinationModel?: { modelName: string; decimalYear: number; latDeg: number; lonDeg: number };
  /** Range of the effective water sound speeds used over the fixes, m/s (`NaN` when none was solved). */
  waterSoundSpeedMinMps: number;
  waterSoundSpeedMaxMps: number;
}

/** Per fix and in summary, how far the re-solve moved the positions from the logged ones. */
export interface ResolveComparison {
  fixCount: number;
  resolvedCount: number;
  rejectedCount: number;
  /** Horizontal geodesic distance logged → re-solved per input fix, metres; `NaN` when either is missing. */
  movedM: Float64Array;
  summary: MovementSummary;
  /** The audit of the logged track and of the re-solved one, with the same profile and setup. */
  audit: { profile: string; logged: AuditOutcome; resolved: AuditOutcome };
}

/** A track's audit in brief. */
export interface AuditOutcome {
  verdict: Verdict;
  findingCount: number;
  /** Fixes some check flagged as suspect. */
  flaggedCount: number;
}

/** Everything a re-solve returns. */
export interface ResolveResult {
  /** The re-solved vehicle track: the input's fixes and columns with new positions; rejected fixes left out. */
  track: Track & { provenance: ResolvedProvenance };
  /** The validated setup with defaults filled in (also in `track.provenance.resolveSetup`). */
  setup: ResolveSetup;
  applied: AppliedSetup;
  /** Input fix index of each output fix. */
  sourceIndex: Uint32Array;
  rejections: ResolveRejection[];
  comparison: ResolveComparison;
}

/** Extra inputs for {@link resolveTrack}. */
export interface ResolveTrackOptions {
  /** One-way travel times per input fix, seconds; needed when the setup's range observation is a travel time. */
  oneWayTravelTimeS?: ArrayLike<number>;
  /**
   * The surface unit's own track, used (interpolated linearly in time) where the vehicle track
   * lacks the surface position or heading beside a fix. Fixes further than
   * `maxSurfaceGapMs` from the nearest surface fix on either side get no surface values.
   */
  surfaceTrack?: Track;
  /** Largest gap, ms, bridged when interpolating the surface track; default 10 000. */
  maxSurfaceGapMs?: number;
  /** The audit profile both tracks are audited with; default the audit's own default. */
  auditProfile?: AuditProfile;
  /** The audit setup; its transceiver draft defaults to the re-solve setup's. */
  auditSetup?: AuditSetup;
}

/**
 * Re-solves a vehicle track from its raw acoustic observations (slant range or one-way travel
 * time, bearing, vehicle depth, surface unit position and heading) with a corrected setup: ranges
 * are rescaled from the logged sound speed to the water's (harmonic mean over each path's depth
 * span), azimuth = heading + heading offset + declination + relative bearing (true and magnetic
 * bearings are first taken back with the logged offsets), the lever arm is turned with the
 * heading, and positions come from geodesic direct problems on WGS 84 (see
 * `solveVehiclePosition`). The comparison gives how far each fix moved (median, 95th percentile,
 * max) and the audit verdicts of the logged and the re-solved track. Fixes that cannot be
 * positioned become `ResolveRejection`s (missing observations, vertical separation larger than
 * the slant range); none is dropped silently.
 * Throws `InvalidArgumentError` for an invalid setup, a surface track passed as the vehicle, a
 * bearing reference that neither the log nor the setup states, or a WMM declination without a
 * usable place and time.
 */
export function resolveTrack(track: Track, setupInput: unknown, options: ResolveTrackOptions = {}): ResolveResult {
  const setup = parseResolveSetup(setupInput);
  if (track.role !== 'vehicle')
    throw new InvalidArgumentError(`re-solve needs a vehicle track, got a ${track.role} track (${track.id})`);
  const n = track.length;
  const cols = track.columns;

  const { reference: bearingReference, from: bearingReferenceFrom } = pickBearingReference(setup, track);
  const travelTimes = options.oneWayTravelTimeS;
  if (setup.rangeObservation.kind === 'one-way-travel-time' && (travelTimes === undefined || travelTimes.length !== n))
    throw new InvalidArgumentError(
      `the setup says ranges are one-way travel times, so ${n} travel times are needed (one per fix)`,
    );

  const surface = surfaceColumns(track, setup, options);
  const declination = pickDeclination(setup, track, surface);

  const draftM = setup.transceiverDraft.valueM;
  const loggedMps = setup.soundSpeed.loggedMps;
  const water = setup.soundSpeed.water;
  let maxDepthM = draftM;
  for (let i = 0; i < n; i++) {
    const d = cols.depthM[i] as number;
    if (d > maxDepthM) maxDepthM = d;
  }
  const pathSpeed =
    water === undefined ? undefined : createPathSoundSpeed(water, maxDepthM, firstFinite(surface.latDeg));

  const offsetDeg = setup.headingOffset.valueDeg;
  const fixedHeading =
    setup.surfacePosition.method === 'fixed' && setup.surfacePosition.headingTrueDeg !== undefined
      ? setup.surfacePosition.headingTrueDeg
      : undefined;
  // What a logged true or magnetic bearing already contains, to be taken back out.
  const bearingCorrectionDeg =
    bearingReference === 'true'
      ? offsetDeg - setup.loggedWith.headingOffsetDeg + declination.declinationDeg - setup.loggedWith.declinationDeg
      : bearingReference === 'magnetic'
        ? offsetDeg - setup.loggedWith.headingOffsetDeg + declination.declinationDeg
        : 0;

  const builder = new TrackBuilder(Math.max(1, n));
  const segmentStarts = new Set(track.segmentStarts);
  const sourceIndex: number[] = [];
  const rejections: ResolveRejection[] = [];
  const movedM = new Float64Array(n).fill(Number.NaN);
  let minMps = Number.POSITIVE_INFINITY;
  let maxMps = Number.NEGATIVE_INFINITY;
  let segmentPending = false;

  for (let i = 0; i < n; i++) {
    if (segmentStarts.has(i)) segmentPending = true;
    const vehicleDepthM = cols.depthM[i] as number;
    // Without a depth the path's sound speed is unknown; the range is passed on unscaled so the
    // rejection names the missing depth rather than a missing range.
    const waterMps =
      pathSpeed === undefined || !Number.isFinite(vehicleDepthM) ? loggedMps : pathSpeed(draftM, vehicleDepthM);
    const slantRangeM =
      setup.rangeObservation.kind === 'one-way-travel-time'
        ? (travelTimes?.[i] ?? Number.NaN) * waterMps
        : ((cols.slantRangeM[i] as number) * waterMps) / loggedMps;
    const trueHeadingDeg = fixedHeading ?? (surface.headingDeg[i] as number) + offsetDeg + declination.declinationDeg;
    const bearingDeg = cols.bearingDeg[i] as number;
    const azimuthDeg =
      bearingReference === 'relative' ? trueHeadingDeg + bearingDeg : bearingDeg + bearingCorrectionDeg;

    const result =
      bearingReference === 'relative' && Number.isFinite(bearingDeg) && !Number.isFinite(trueHeadingDeg)
        ? ({
            ok: false,
            reason: 'missing-surface-heading',
            message: 'no surface unit heading for a relative bearing',
          } as const)
        : solveVehiclePosition({
            surfaceLatDeg: surface.latDeg[i] as number,
            surfaceLonDeg: surface.lonDeg[i] as number,
            surfaceHeadingTrueDeg: trueHeadingDeg,
            leverArmForwardM: setup.leverArm.forwardM,
            leverArmStarboardM: setup.leverArm.starboardM,
            transceiverDepthM: draftM,
            slantRangeM,
            azimuthDeg,
            vehicleDepthM,
          });
    if (!result.ok) {
      rejections.push({
        index: i,
        line: track.sourceLines[i] ?? 0,
        timeMs: cols.timeMs[i] as number,
        reason: result.reason,
        message: `fix ${i + 1}: ${result.message}`,
      });
      continue;
    }
    if (waterMps < minMps) minMps = waterMps;
    if (waterMps > maxMps) maxMps = waterMps;
    const fix = getFix(track, i);
    fix.latDeg = result.latDeg;
    fix.lonDeg = result.lonDeg;
    if (segmentPending) {
      builder.startSegment();
      segmentPending = false;
    }
    builder.push(fix, track.sourceLines[i] ?? 0);
    sourceIndex.push(i);
    const oldLat = cols.latDeg[i] as number;
    const oldLon = cols.lonDeg[i] as number;
    if (Number.isFinite(oldLat) && Number.isFinite(oldLon))
      movedM[i] = geodesicDistanceM(oldLat, oldLon, result.latDeg, result.lonDeg);
  }

  const provenance: ResolvedProvenance = { ...track.provenance, resolveSetup: setup, resolvedFrom: track.id };
  const built = builder.build({
    id: `${track.id}-resolved`,
    role: 'vehicle',
    ...(track.name === undefined ? {} : { name: track.name }),
    provenance,
  });
  const resolved = { ...built, provenance };
  const applied: AppliedSetup = {
    bearingReference,
    bearingReferenceFrom,
    declinationDeg: declination.declinationDeg,
    ...(declination.model === undefined ? {} : { declinationModel: declination.model }),
    waterSoundSpeedMinMps: sourceIndex.length === 0 ? Number.NaN : minMps,
    waterSoundSpeedMaxMps: sourceIndex.length === 0 ? Number.NaN : maxMps,
  };
  const auditSetup: AuditSetup = { transceiverDraftM: draftM, ...options.auditSetup };
  const auditOptions = {
    ...(options.auditProfile === undefined ? {} : { profile: options.auditProfile }),
    setup: auditSetup,
  };
  const loggedAudit = auditTrack(track, auditOptions);
  const resolvedAudit = auditTrack(resolved, auditOptions);
  return {
    track: resolved,
    setup,
    applied,
    sourceIndex: Uint32Array.from(sourceIndex),
    rejections,
    comparison: {
      fixCount: n,
      resolvedCount: sourceIndex.length,
      rejectedCount: rejections.length,
      movedM,
      summary: summariseMovement(movedM),
      audit: {
        profile: resolvedAudit.profile,
        logged: briefAudit(loggedAudit),
        resolved: briefAudit(resolvedAudit),
      },
    },
  };
}

function briefAudit(result: ReturnType<typeof auditTrack>): AuditOutcome {
  return { verdict: result.verdict, findingCount: result.findings.length, flaggedCount: result.flaggedCount };
}

function pickBearingReference(
  setup: ResolveSetup,
  track: Track,
): { reference: Exclude<BearingReference, 'unknown'>; from: AppliedSetup['bearingReferenceFrom'] } {
  const stated = setup.bearingReference.value;
  if (stated !== 'from-log') return { reference: stated, from: 'setup' };
  const fromLog = track.provenance.bearingReference;
  if (fromLog !== undefined && fromLog !== 'unknown') return { reference: fromLog, from: 'log' };
  const header = track.provenance.columnMapping?.bearingDeg;
  const fromHeader = header === undefined ? undefined : bearingReferenceFromHeader(header);
  if (fromHeader !== undefined) return { reference: fromHeader, from: 'column-name' };
  throw new InvalidArgumentError(
    `${track.provenance.sourceFile}: the log does not say what its bearings are measured from; set bearingReference.value in the setup to relative, true or magnetic`,
  );
}

/**
 * What a bearing column's header says its bearings are measured from, e.g. `bearing_rel_deg` →
 * `relative`, `Brg (T)` → `true`, `bearing magnetic` → `magnetic`; `undefined` when it says
 * nothing or contradicts itself.
 */
export function bearingReferenceFromHeader(header: string): Exclude<BearingReference, 'unknown'> | undefined {
  const words = header
    .toLowerCase()
    .split(/[^a-z]+/)
    .filter((w) => w !== '');
  const found = new Set<Exclude<BearingReference, 'unknown'>>();
  for (const w of words) {
    if (w === 'rel' || w === 'relative' || w === 'bow') found.add('relative');
    else if (w === 't' || w === 'true' || w === 'tru' || w === 'north') found.add('true');
    else if (w === 'mag' || w === 'magnetic') found.add('magnetic');
  }
  return found.size === 1 ? [...found][0] : undefined;
}

interface SurfaceColumns {
  latDeg: Float64Array;
  lonDeg: Float64Array;
  headingDeg: Float64Array;
}

/** The surface unit's position and logged heading per vehicle fix, from the setup, the track or a surface track. */
function surfaceColumns(track: Track, setup: ResolveSetup, options: ResolveTrackOptions): SurfaceColumns {
  const n = track.length;
  const cols = track.columns;
  const latDeg = Float64Array.from(cols.surfaceLatDeg);
  const lonDeg = Float64Array.from(cols.surfaceLonDeg);
  const headingDeg = Float64Array.from(cols.surfaceHeadingDeg);
  const surfaceTrack = options.surfaceTrack;
  if (surfaceTrack !== undefined && surfaceTrack.length > 0) {
    const maxGapMs = options.maxSurfaceGapMs ?? 10_000;
    for (let i = 0; i < n; i++) {
      const needPosition = !Number.isFinite(latDeg[i] as number) || !Number.isFinite(lonDeg[i] as number);
      const needHeading = !Number.isFinite(headingDeg[i] as number);
      if (!needPosition && !needHeading) continue;
      const at = interpolateSurface(surfaceTrack, cols.timeMs[i] as number, maxGapMs);
      if (at === undefined) continue;
      if (needPosition) {
        latDeg[i] = at.latDeg;
        lonDeg[i] = at.lonDeg;
      }
      if (needHeading) headingDeg[i] = at.headingDeg;
    }
  }
  if (setup.surfacePosition.method === 'fixed') {
    latDeg.fill(setup.surfacePosition.latDeg);
    lonDeg.fill(setup.surfacePosition.lonDeg);
  }
  return { latDeg, lonDeg, headingDeg };
}

/** Linear interpolation of the surface track at `timeMs` (heading along the shorter arc); assumes times increase. */
function interpolateSurface(
  surface: Track,
  timeMs: number,
  maxGapMs: number,
): { latDeg: number; lonDeg: number; headingDeg: number } | undefined {
  const t = surface.columns.timeMs;
  if (!Number.isFinite(timeMs)) return undefined;
  let lo = 0;
  let hi = surface.length - 1;
  if (timeMs < (t[lo] as number) - maxGapMs || timeMs > (t[hi] as number) + maxGapMs) return undefined;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if ((t[mid] as number) <= timeMs) lo = mid;
    else hi = mid;
  }
  const c = surface.columns;
  const t0 = t[lo] as number;
  const t1 = t[hi] as number;
  if (timeMs <= t0 || hi === lo) return timeMs < t0 - maxGapMs ? undefined : pick(c.latDeg, c.lonDeg, c.headingDeg, lo);
  if (timeMs >= t1) return timeMs > t1 + maxGapMs ? undefined : pick(c.latDeg, c.lonDeg, c.headingDeg, hi);
  if (t1 - t0 > maxGapMs) return undefined;
  const f = (timeMs - t0) / (t1 - t0);
  const lerp = (a: number, b: number): number => a + f * (b - a);
  const h0 = c.headingDeg[lo] as number;
  const h1 = c.headingDeg[hi] as number;
  const dh = ((((h1 - h0) % 360) + 540) % 360) - 180;
  // Longitude along the shorter way too, so a surface unit on the antimeridian is not sent round the world.
  const lon0 = c.lonDeg[lo] as number;
  const dLon = (((((c.lonDeg[hi] as number) - lon0) % 360) + 540) % 360) - 180;
  return {
    latDeg: lerp(c.latDeg[lo] as number, c.latDeg[hi] as number),
    lonDeg: normaliseLongitudeDeg(lon0 + f * dLon),
    headingDeg: normaliseAzimuthDeg(h0 + f * dh),
  };
}

function pick(lat: Float64Array, lon: Float64Array, heading: Float64Array, i: number) {
  return { latDeg: lat[i] as number, lonDeg: lon[i] as number, headingDeg: heading[i] as number };
}

function firstFinite(values: Float64Array): number {
  for (const v of values) if (Number.isFinite(v)) return v;
  return Number.NaN;
}

/** The declination for the whole dive: a number from the setup, or WMM at the first surface position and the middle time. */
function pickDeclination(
  setup: ResolveSetup,
  track: Track,
  surface: SurfaceColumns,
): { declinationDeg: number; model?: AppliedSetup['declinationModel'] } {
  if (setup.declination.method === 'value') return { declinationDeg: setup.declination.valueDeg };
  let latDeg = Number.NaN;
  let lonDeg = Number.NaN;
  for (let i = 0; i < track.length; i++) {
    if (Number.isFinite(surface.latDeg[i] as number) && Number.isFinite(surface.lonDeg[i] as number)) {
      latDeg = surface.latDeg[i] as number;
      lonDeg = surface.lonDeg[i] as number;
      break;
    }
  }
  const times = Array.from(track.columns.timeMs).filter(Number.isFinite);
  const timeMs = times.length === 0 ? Number.NaN : ((times[0] as number) + (times[times.length - 1] as number)) / 2;
  if (!Number.isFinite(latDeg) || !Number.isFinite(timeMs))
    throw new InvalidArgumentError(
      `${track.provenance.sourceFile}: a WMM declination needs a surface position and a fix time; give declination as a value instead`,
    );
  // A dive spans hundreds of metres and a few hours, over which WMM declination changes by hundredths of a degree at most, so one value serves the dive.
  const result = magneticDeclination(latDeg, lonDeg, timeMs, 0);
  return {
    declinationDeg: result.declinationDeg,
    model: { modelName: result.modelName, decimalYear: result.decimalYear, latDeg, lonDeg },
  };
}
