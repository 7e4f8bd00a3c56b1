import {
  auditTrack,
  type Finding,
  PRESET_PROFILES,
  planSeason,
  S44_ORDERS,
  simulateDive,
  summariseDive,
  trackFromSimulatedDive,
} from '@leadline/core';
import { SEVERITY_CODE } from '../lib/prepare-plot-data';
import type { DiveFinding, DiveViewData, GridCrsChoice } from '../types';

/** Options of `createSimulatedDive`. */
export interface SimulatedDiveOptions {
  /** About how many vehicle fixes to simulate (dropouts remove a few). */
  fixCount: number;
  /** Seed of the season the dive is taken from; the same seed gives the same dive. */
  seed: number;
}

// How many dives of the season to plan while looking for one flown by an ROV from a boat.
const SEASON_LOOKAHEAD = 40;

function wgs84UtmChoice(code: string, name: string): GridCrsChoice | undefined {
  const match = /^EPSG:(326|327)(\d{2})$/.exec(code);
  if (!match) return undefined;
  const south = match[1] === '327';
  return {
    code,
    name,
    proj4: `+proj=utm +zone=${Number(match[2])}${south ? ' +south' : ''} +datum=WGS84 +units=m +no_defs`,
  };
}

function toFinding(finding: Finding, index: number): DiveFinding {
  return {
    id: `${finding.check}-${finding.startIndex}-${index}`,
    check: finding.check,
    severity: finding.severity,
    startIndex: finding.startIndex,
    endIndex: finding.endIndex,
    startTimeMs: finding.startTimeMs,
    endTimeMs: finding.endTimeMs,
    message: finding.message,
  };
}

/**
 * A dive from core's simulator, audited and summarised by core, in the dive view's props. Plans a
 * season from the seed and takes its first dive flown by an ROV from a boat around a net pen or along a
 * quay (else any ROV dive from a boat, else the first dive),
 * with the interval chosen so the dive has about `fixCount` fixes (1 s up to 20 000, 0.2 s above).
 */
export function createSimulatedDive({ fixCount, seed }: SimulatedDiveOptions): DiveViewData {
  const intervalS = fixCount > 20_000 ? 0.2 : 1;
  const diveMinutes = Math.max(5, Math.ceil((fixCount * intervalS) / 60));
  const planned = planSeason({ seed, dives: SEASON_LOOKAHEAD, diveMinutes, sampleIntervalS: intervalS });
  const byBoat = (p: (typeof planned)[number]) =>
    p.spec.surfaceUnit.kind === 'boat' && p.spec.flight.platform.name !== 'diver';
  const chosen =
    planned.find(
      (p) => byBoat(p) && (p.spec.flight.pattern.kind === 'circles' || p.spec.flight.pattern.kind === 'lawnmower'),
    ) ??
    planned.find(byBoat) ??
    planned[0];
  if (chosen === undefined) throw new Error('the simulator planned no dive');
  const { spec } = chosen;
  const dive = simulateDive(spec);
  const track = trackFromSimulatedDive(dive);
  const platform = spec.flight.platform.name;
  const audit = auditTrack(track, {
    profile: PRESET_PROFILES[platform],
    // A quay station is meant to stay put; a boat holding position is not moored.
    setup: { surfaceStationary: spec.surfaceUnit.kind === 'quay', transceiverDraftM: spec.loggedSetup.draftM },
  });
  const n = track.length;
  const flagged = new Uint8Array(n);
  for (let i = 0; i < n; i++) flagged[i] = audit.flags[i] === 0 ? 0 : 1;
  const summary = summariseDive(track, { flagged });
  // A fix is marked with the worst finding that covers it and flagged it.
  const fixSeverity = new Uint8Array(n);
  for (const finding of audit.findings) {
    const code = SEVERITY_CODE[finding.severity];
    for (let i = Math.max(0, finding.startIndex); i <= Math.min(n - 1, finding.endIndex); i++)
      if (flagged[i] === 1 && (fixSeverity[i] as number) < code) fixSeverity[i] = code;
  }
  const siteCrs = wgs84UtmChoice(spec.site.crs, `WGS 84 / UTM (${spec.site.name})`);
  return {
    id: spec.diveId,
    title: `Preview dive: ${spec.site.name}`,
    subtitle: `Hollowtide Subsea · ${platform.replace('-', ' ').replace('rov', 'ROV')} · ${spec.surfaceUnit.name} · ${n.toLocaleString('en-GB')} simulated fixes`,
    verdict: audit.verdict,
    vehicle: {
      timeMs: track.columns.timeMs,
      latDeg: track.columns.latDeg,
      lonDeg: track.columns.lonDeg,
      depthM: track.columns.depthM,
    },
    surface: { timeMs: dive.surfaceLog.timeMs, latDeg: dive.surfaceLog.latDeg, lonDeg: dive.surfaceLog.lonDeg },
    fixSeverity,
    findings: audit.findings.map(toFinding),
    summary: {
      startTimeMs: summary.startTimeMs,
      endTimeMs: summary.endTimeMs,
      durationS: summary.durationS,
      fixCount: summary.fixCount,
      meanFixRateHz: summary.meanFixRateHz,
      distanceM: summary.distanceM,
      distance3dM: summary.distance3dM,
      maxDepthM: summary.maxDepthM,
      meanDepthM: summary.meanDepthM,
      timeOnBottomS: summary.timeOnBottomS,
      maxHorizontalRangeM: summary.maxHorizontalRangeM,
      maxSlantRangeM: summary.maxSlantRangeM,
      flaggedShare: summary.flaggedShare,
    },
    s44: audit.s44.map((share) => ({
      order: share.order,
      label: S44_ORDERS.find((o) => o.order === share.order)?.label ?? share.order,
      judged: share.judged,
      meeting: share.meeting,
      share: Number.isFinite(share.share) ? share.share : null,
    })),
    crsChoices: siteCrs ? [siteCrs] : [],
  };
}

/** The typed arrays of a dive view's data, to hand over to another thread without copying. */
export function transferablesOf(data: DiveViewData): ArrayBuffer[] {
  const columns = [
    data.vehicle.timeMs,
    data.vehicle.latDeg,
    data.vehicle.lonDeg,
    data.vehicle.depthM,
    data.surface?.timeMs,
    data.surface?.latDeg,
    data.surface?.lonDeg,
    data.fixSeverity,
  ];
  const buffers = new Set<ArrayBuffer>();
  for (const column of columns)
    if (ArrayBuffer.isView(column) && column.buffer instanceof ArrayBuffer) buffers.add(column.buffer);
  return [...buffers];
}
