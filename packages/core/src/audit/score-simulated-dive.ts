import { smoothTrack } from '../clean/smooth-track.js';
import { createLocalFrame } from '../geodesy/create-local-frame.js';
import type { Track } from '../model/track.js';
import type { InjectedFaultKind, SimulatedDive } from '../simulate/simulate-dive.js';
import { FLAG_BITS } from './audit-context.js';
import { type AuditProfile, PRESET_PROFILES } from './audit-profile.js';
import { type AuditResult, auditTrack } from './audit-track.js';

/** The injected fault kinds an audit of one log can see; the others are wrong setup values, found by re-solving. */
export const AUDITABLE_FAULT_KINDS: readonly InjectedFaultKind[] = [
  'multipath-outlier',
  'dropout',
  'repeated-time',
  'backwards-time',
  'surface-drift',
];

/** How an audit and the smoother did on one simulated dive, against its truth. */
export interface SimulatedDiveScore {
  diveId: string;
  profile: string;
  fixes: number;
  /** Per auditable fault kind: how many were injected and how many the audit found. */
  byKind: Partial<Record<InjectedFaultKind, { injected: number; found: number }>>;
  injected: number;
  found: number;
  /** Fixes not made by an injected fault (no outlier, no time glitch), and how many of those were flagged. */
  cleanFixes: number;
  flaggedCleanFixes: number;
  /** RMS horizontal error against the true track, metres: all fixes as logged, and after audit + smoothing. */
  rmsLoggedM: number;
  rmsSmoothedM: number;
  /** The same over clean fixes only (measurement noise and setup errors, outliers left out). */
  rmsLoggedCleanM: number;
  rmsSmoothedCleanM: number;
  /** Setup faults present (not auditable from the log alone). */
  setupFaults: InjectedFaultKind[];
  audit: AuditResult;
}

/** The vehicle log of a simulated dive as a track (columns copied straight from the simulator). */
export function trackFromSimulatedDive(dive: SimulatedDive): Track {
  const log = dive.vehicleLog;
  const n = log.length;
  const nan = () => new Float64Array(n).fill(Number.NaN);
  return {
    id: dive.spec.diveId,
    role: 'vehicle',
    name: dive.spec.diveId,
    length: n,
    columns: {
      timeMs: log.timeMs,
      latDeg: log.latDeg,
      lonDeg: log.lonDeg,
      depthM: log.depthM,
      headingDeg: log.headingDeg,
      speedMps: nan(),
      quality: nan(),
      slantRangeM: log.slantRangeM,
      bearingDeg: log.bearingDeg,
      surfaceLatDeg: log.surfaceLatDeg,
      surfaceLonDeg: log.surfaceLonDeg,
      surfaceHeadingDeg: log.surfaceHeadingDeg,
    },
    segmentStarts: n > 0 ? [0] : [],
    sourceLines: new Uint32Array(n),
    provenance: {
      sourceFile: `${dive.spec.diveId}.sim`,
      format: 'csv',
      dialect: 'simulated',
      timeZone: 'UTC',
      depthSign: { rule: 'depth', doubtful: false, reason: 'simulated depths' },
    },
  };
}

/**
 * Audits and smooths one simulated dive and scores both against its truth. A fault counts as
 * found when: a multipath outlier's fix is flagged by any check; a repeated or backwards timestamp's
 * fix is flagged by the repeated-time or time-backwards check; a dropout lies inside a time-gap
 * finding; a surface-unit drift overlaps a surface-drift finding. The audit runs with the preset
 * profile of the dive's platform (or `profile`), the setup's draft, and the surface unit marked
 * stationary (a quay; or a boat meant to hold position, judged against 10 m / 25 m drift limits).
 */
export function scoreSimulatedDive(dive: SimulatedDive, profile?: AuditProfile): SimulatedDiveScore {
  const track = trackFromSimulatedDive(dive);
  const platform = dive.spec.flight.platform.name;
  const chosen = profile ?? PRESET_PROFILES[platform];
  // The system's stated accuracy at 95 %, as an operator would enter it from the equipment's data
  // sheets: the simulator's 1-sigma noise model scaled by 2.45 (S-44 Ed. 6 ch. 2, 2-D 95 %); the
  // USBL's lateral error (bearing noise × range) is usually the larger, so the larger of the two.
  const noise = dive.spec.noise;
  const lateralFraction = (noise.bearingSigmaDeg * Math.PI) / 180;
  const audit = auditTrack(track, {
    profile: chosen,
    setup: {
      surfaceStationary: true,
      // a boat holding position is judged against a 10 m circle, a quay pole against the profile's 5 m
      ...(dive.spec.surfaceUnit.kind === 'boat' ? { surfaceDriftWarnM: 10, surfaceDriftFailM: 25 } : {}),
      transceiverDraftM: dive.spec.loggedSetup.draftM,
      uncertainty: {
        usblRangeFraction: 2.45 * Math.max(noise.rangeFraction, lateralFraction),
        usblFloorM: 2.45 * noise.rangeFloorM,
        gnssHorizontal95M: 2.45 * noise.gnssSigmaM,
        heading95Deg: 1.96 * noise.compassSigmaDeg,
      },
    },
  });
  const smoothed = smoothTrack(track, {
    accelerationSigmaMps2: chosen.smoothingAccelerationMps2,
    horizontal95M: audit.uncertainty.horizontal95M,
    flags: audit.flags,
    maxGapS: chosen.gapFailS,
  }).track;

  const log = dive.vehicleLog;
  const intervalMs = dive.truth.sampleIntervalS * 1000;
  const rowOfSample = new Int32Array(dive.truth.vehicle.timeMs.length).fill(-1);
  for (let r = 0; r < log.length; r++) rowOfSample[log.truthIndex[r] as number] = r;
  const faultRow = new Uint8Array(log.length);
  const byKind: SimulatedDiveScore['byKind'] = {};
  const setupFaults: InjectedFaultKind[] = [];
  const timeBits = (FLAG_BITS['repeated-time'] ?? 0) | (FLAG_BITS['time-backwards'] ?? 0);
  for (const fault of dive.truth.faults) {
    if (!AUDITABLE_FAULT_KINDS.includes(fault.kind)) {
      setupFaults.push(fault.kind);
      continue;
    }
    let found = false;
    if (fault.kind === 'multipath-outlier' || fault.kind === 'repeated-time' || fault.kind === 'backwards-time') {
      const sample = Math.round((fault.startTimeMs - dive.truth.startTimeMs) / intervalMs);
      const row = rowOfSample[sample] ?? -1;
      if (row < 0) continue; // the sample was dropped: nothing was logged to find
      faultRow[row] = 1;
      const bits = audit.flags[row] as number;
      found = fault.kind === 'multipath-outlier' ? bits !== 0 : (bits & timeBits) !== 0;
    } else if (fault.kind === 'dropout') {
      found = audit.findings.some(
        (f) => f.check === 'time-gap' && f.startTimeMs < fault.startTimeMs && f.endTimeMs > fault.endTimeMs,
      );
    } else {
      found = audit.findings.some(
        (f) => f.check === 'surface-drift' && f.startTimeMs <= fault.endTimeMs && f.endTimeMs >= fault.startTimeMs,
      );
    }
    const tally = byKind[fault.kind] ?? { injected: 0, found: 0 };
    tally.injected++;
    if (found) tally.found++;
    byKind[fault.kind] = tally;
  }
  let injected = 0;
  let found = 0;
  for (const tally of Object.values(byKind)) {
    injected += tally.injected;
    found += tally.found;
  }

  const frame = createLocalFrame(dive.spec.site.originLatDeg, dive.spec.site.originLonDeg);
  const sums = { logged: 0, smoothed: 0, loggedClean: 0, smoothedClean: 0 };
  let cleanFixes = 0;
  let flaggedCleanFixes = 0;
  for (let r = 0; r < log.length; r++) {
    const s = log.truthIndex[r] as number;
    const t = frame.forward(dive.truth.vehicle.latDeg[s] as number, dive.truth.vehicle.lonDeg[s] as number);
    const a = frame.forward(log.latDeg[r] as number, log.lonDeg[r] as number);
    const b = frame.forward(smoothed.columns.latDeg[r] as number, smoothed.columns.lonDeg[r] as number);
    const eLogged = (a.eastM - t.eastM) ** 2 + (a.northM - t.northM) ** 2;
    const eSmoothed = (b.eastM - t.eastM) ** 2 + (b.northM - t.northM) ** 2;
    sums.logged += eLogged;
    sums.smoothed += eSmoothed;
    if (faultRow[r] === 0) {
      cleanFixes++;
      if (audit.flags[r] !== 0) flaggedCleanFixes++;
      sums.loggedClean += eLogged;
      sums.smoothedClean += eSmoothed;
    }
  }
  const n = Math.max(1, log.length);
  const c = Math.max(1, cleanFixes);
  return {
    diveId: dive.spec.diveId,
    profile: chosen.name,
    fixes: log.length,
    byKind,
    injected,
    found,
    cleanFixes,
    flaggedCleanFixes,
    rmsLoggedM: Math.sqrt(sums.logged / n),
    rmsSmoothedM: Math.sqrt(sums.smoothed / n),
    rmsLoggedCleanM: Math.sqrt(sums.loggedClean / c),
    rmsSmoothedCleanM: Math.sqrt(sums.smoothedClean / c),
    setupFaults,
    audit,
  };
}
