import { type Finding, resolveCrs, resolveTrack, S44_ORDERS, type Track } from '@leadline/core';
import { AppError } from '../http/errors.js';
import type { AuthContext } from '../http/route-table.js';
import type { DiveStore } from '../stores/dive-store.js';

/** How the dive view checks that the caller may see a dive of an organisation. */
export interface MembershipCheck {
  roleOf(organisationId: string, userId: string): Promise<string | undefined>;
  /** Whether the API token belongs to this organisation. */
  tokenBelongsTo(organisationId: string, tokenId: string): Promise<boolean>;
}

const SEVERITY_RANK: Record<Finding['severity'], number> = { info: 1, warn: 2, fail: 3 };

function column(values: Float64Array, n: number): Array<number | null> {
  const out: Array<number | null> = new Array(n);
  for (let i = 0; i < n; i++) {
    const v = values[i] as number;
    out[i] = Number.isNaN(v) ? null : v;
  }
  return out;
}

/**
 * One dive as the web's dive page draws it: the audited fixes as columns (`null` for missing), the
 * worst finding severity per fix, the findings, summary, S-44 shares and the project's CRS. A dive
 * of an organisation the caller is not in answers 404 like a dive that does not exist.
 */
export async function getDiveView(
  deps: { dives: DiveStore; membership: MembershipCheck },
  auth: AuthContext,
  diveId: string,
) {
  const notFound = new AppError('not-found', `No dive ${diveId}.`);
  const found = await deps.dives.findWithProject(diveId);
  if (found === undefined || auth.userId === null) throw notFound;
  if ((await deps.membership.roleOf(found.organisationId, auth.userId)) === undefined) throw notFound;
  if (
    auth.via === 'token' &&
    (auth.tokenId === null || !(await deps.membership.tokenBelongsTo(found.organisationId, auth.tokenId)))
  )
    throw notFound;
  const { dive } = found;
  const result = dive.latestResultId === null ? undefined : await deps.dives.result(dive.id, dive.latestResultId);
  const tracks = await deps.dives.tracks(dive.id);
  if (result === undefined || tracks === undefined) throw notFound;
  // The findings index into the audited track: the re-solved one when the latest run re-solved.
  let audited: Track = tracks.vehicle;
  if (result.resolveSetup !== null && result.resolveSetup !== undefined)
    audited = resolveTrack(
      tracks.vehicle,
      result.resolveSetup,
      tracks.surface === undefined ? {} : { surfaceTrack: tracks.surface },
    ).track;
  const n = audited.length;
  const severity = new Array<number>(n).fill(0);
  const findings = result.report.findings.map((f, k) => {
    const rank = SEVERITY_RANK[f.severity];
    for (let i = Math.max(0, f.startIndex); i <= Math.min(n - 1, f.endIndex); i++)
      if ((severity[i] as number) < rank) severity[i] = rank;
    return {
      id: `${result.id}-${k}`,
      check: f.check,
      severity: f.severity,
      startIndex: f.startIndex,
      endIndex: f.endIndex,
      startTimeMs: f.startTime === null ? null : Date.parse(f.startTime),
      endTimeMs: f.endTime === null ? null : Date.parse(f.endTime),
      message: f.message,
    };
  });
  const s = result.summary;
  let projectCrs: { code: string; name: string; proj4: string } | null = null;
  if (found.defaultCrs !== null) {
    try {
      const crs = resolveCrs(found.defaultCrs);
      if (crs.kind === 'projected') projectCrs = { code: crs.code, name: crs.name, proj4: crs.proj4 };
    } catch {
      projectCrs = null;
    }
  }
  const c = audited.columns;
  return {
    id: dive.id,
    name: `Dive ${dive.diveNumber}${s.startTime === null ? '' : ` · ${s.startTime.slice(0, 16).replace('T', ' ')} UTC`}`,
    organisationId: found.organisationId,
    projectId: dive.projectId,
    projectName: found.projectName,
    logId: dive.logId,
    resultId: result.id,
    site: found.site,
    vehicle: dive.trackName,
    logFileName: dive.logFileName,
    verdict: result.verdict,
    fixes: {
      timeMs: column(c.timeMs, n),
      latDeg: column(c.latDeg, n),
      lonDeg: column(c.lonDeg, n),
      depthM: column(c.depthM, n),
      severity,
    },
    surfaceFixes:
      tracks.surface === undefined
        ? null
        : {
            timeMs: column(tracks.surface.columns.timeMs, tracks.surface.length),
            latDeg: column(tracks.surface.columns.latDeg, tracks.surface.length),
            lonDeg: column(tracks.surface.columns.lonDeg, tracks.surface.length),
          },
    findings,
    summary: {
      startTimeMs: s.startTimeMs,
      endTimeMs: s.endTimeMs,
      durationS: s.durationS,
      fixCount: s.fixCount,
      meanFixRateHz: s.meanFixRateHz,
      distanceM: s.distanceM,
      distance3dM: s.distance3dM,
      maxDepthM: s.maxDepthM,
      meanDepthM: s.meanDepthM,
      timeOnBottomS: s.timeOnBottomS,
      maxHorizontalRangeM: s.maxHorizontalRangeM,
      maxSlantRangeM: s.maxSlantRangeM,
      flaggedShare: s.flaggedShare,
    },
    s44: result.report.s44.map((share) => ({
      order: share.order,
      label: S44_ORDERS.find((o) => o.order === share.order)?.label ?? share.order,
      judged: share.judged,
      meeting: share.meeting,
      share: share.share,
    })),
    projectCrs,
  };
}
