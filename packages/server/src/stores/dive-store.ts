import type { DiveReport, DiveSummary, Finding, Track, Verdict } from '@leadline/core';
import type { Knex } from 'knex';
import { decodeTrack, type EncodedTrack, encodeTrack } from './track-codec.js';

/** A dive as lists show it: where it came from and its latest result's figures. */
export interface DiveRecord {
  id: string;
  projectId: string;
  logId: string;
  logFileName: string;
  diveNumber: number;
  trackName: string;
  startTime: Date | null;
  endTime: Date | null;
  durationS: number | null;
  fixCount: number;
  maxDepthM: number | null;
  distanceM: number | null;
  /** `[west, south, east, north]`, degrees. */
  bboxDeg: [number, number, number, number] | null;
  verdict: Verdict | null;
  auditProfile: string | null;
  latestResultId: string | null;
  summary: DiveSummary;
}

/** What one run made of one dive. */
export interface DiveResultRecord {
  id: string;
  diveId: string;
  runId: string;
  verdict: Verdict;
  auditProfile: string;
  resolveSetup: unknown;
  auditSetup: Record<string, unknown>;
  summary: DiveSummary;
  report: DiveReport;
  resolveComparison: unknown;
  flaggedCount: number;
  createdAt: Date;
}

/** What a track download's cache key is made of (see `DiveStore.trackHead`). */
export interface TrackHead {
  latestResultId: string | null;
  diveNumber: number;
  logFileName: string;
  defaultSetup: unknown;
}

/** A result to store. */
export interface NewDiveResult {
  verdict: Verdict;
  auditProfile: string;
  resolveSetup: unknown;
  auditSetup: Record<string, unknown>;
  summary: DiveSummary;
  report: DiveReport;
  resolveComparison: unknown;
  flags: Uint16Array;
  flaggedCount: number;
  findings: Finding[];
}

/** A dive split out of a log, ready to store with its first result. */
export interface NewDive {
  diveNumber: number;
  vehicle: Track;
  surface?: Track | undefined;
  result: NewDiveResult;
}

/** Filters, order and page of a dive list. */
export interface DiveQuery {
  projectId: string;
  logId?: string | undefined;
  ids?: readonly string[] | undefined;
  from?: Date | undefined;
  to?: Date | undefined;
  /** `[west, south, east, north]`: dives whose box overlaps it. */
  bbox?: readonly [number, number, number, number] | undefined;
  verdicts?: readonly Verdict[] | undefined;
  minDepthM?: number | undefined;
  maxDepthM?: number | undefined;
  text?: string | undefined;
  sort: DiveSort;
  limit: number;
  offset: number;
}

/** The same filters over every project of an organisation. */
export type OrganisationDiveQuery = Omit<DiveQuery, 'projectId'> & { organisationId: string };

/** Orders a dive list can be sorted in (`-` for descending). */
export const DIVE_SORTS = [
  'startTime',
  '-startTime',
  'maxDepth',
  '-maxDepth',
  'duration',
  '-duration',
  'distance',
  '-distance',
] as const;
/** One dive order. */
export type DiveSort = (typeof DIVE_SORTS)[number];

/** Dives, their stored fixes and the results of every run. */
export interface DiveStore {
  /**
   * Stores the dives of a `process` run and marks the run done, all in one transaction; a run
   * already done stores nothing (a job delivered twice). Returns the dive ids, or `undefined` when
   * nothing was stored.
   */
  storeProcessed(runId: string, logId: string, projectId: string, dives: NewDive[]): Promise<string[] | undefined>;
  /** Stores a `reprocess` run's results, makes them the dives' latest and marks the run done, in one transaction. */
  storeReprocessed(runId: string, results: Array<{ diveId: string; result: NewDiveResult }>): Promise<boolean>;
  /** One project's dives, or (with `organisationId` instead) the dives of every project of an organisation. */
  list(query: DiveQuery | OrganisationDiveQuery): Promise<{ dives: DiveRecord[]; total: number }>;
  find(projectId: string, diveId: string): Promise<DiveRecord | undefined>;
  /** A dive by id alone, with its project's organisation, name, site and CRS (for routes outside an organisation). */
  findWithProject(diveId: string): Promise<
    | {
        dive: DiveRecord;
        organisationId: string;
        projectName: string;
        site: string | null;
        defaultCrs: string | null;
      }
    | undefined
  >;
  diveIdsOfLog(logId: string): Promise<string[]>;
  /**
   * What names a rendered track file, in one indexed read: the dive's latest result, number and log
   * name, and its project's default setup; `undefined` unless the dive is in that organisation's project.
   */
  trackHead(organisationId: string, projectId: string, diveId: string): Promise<TrackHead | undefined>;
  tracks(diveId: string): Promise<{ vehicle: Track; surface: Track | undefined } | undefined>;
  /** A dive's results, newest first. */
  results(diveId: string): Promise<DiveResultRecord[]>;
  result(diveId: string, resultId: string): Promise<DiveResultRecord | undefined>;
  flags(resultId: string): Promise<Uint16Array | undefined>;
}

interface DiveRow {
  id: string;
  project_id: string;
  log_id: string;
  original_file_name: string;
  dive_number: number;
  track_name: string;
  start_time: Date | null;
  end_time: Date | null;
  duration_s: number | null;
  fix_count: number;
  max_depth_m: number | null;
  distance_m: number | null;
  bbox_west: number | null;
  bbox_south: number | null;
  bbox_east: number | null;
  bbox_north: number | null;
  verdict: Verdict | null;
  audit_profile: string | null;
  latest_result_id: string | null;
  summary: DiveSummary;
}

interface ResultRow {
  id: string;
  dive_id: string;
  run_id: string;
  verdict: Verdict;
  audit_profile: string;
  resolve_setup: unknown;
  audit_setup: Record<string, unknown>;
  summary: DiveSummary;
  report: DiveReport;
  resolve_comparison: unknown;
  flagged_count: number;
  created_at: Date;
}

const DIVE_COLUMNS = [
  'd.id',
  'd.project_id',
  'd.log_id',
  'l.original_file_name',
  'd.dive_number',
  'd.track_name',
  'd.start_time',
  'd.end_time',
  'd.duration_s',
  'd.fix_count',
  'd.max_depth_m',
  'd.distance_m',
  'd.bbox_west',
  'd.bbox_south',
  'd.bbox_east',
  'd.bbox_north',
  'd.verdict',
  'd.audit_profile',
  'd.latest_result_id',
  'd.summary',
];

const RESULT_COLUMNS = [
  'id',
  'dive_id',
  'run_id',
  'verdict',
  'audit_profile',
  'resolve_setup',
  'audit_setup',
  'summary',
  'report',
  'resolve_comparison',
  'flagged_count',
  'created_at',
];

// Default null order (last ascending, first descending) so the (project_id, column, id) indexes serve either direction.
const SORT_SQL: Record<DiveSort, string> = {
  startTime: 'd.start_time asc, d.id asc',
  '-startTime': 'd.start_time desc, d.id desc',
  maxDepth: 'd.max_depth_m asc, d.id asc',
  '-maxDepth': 'd.max_depth_m desc, d.id desc',
  duration: 'd.duration_s asc, d.id asc',
  '-duration': 'd.duration_s desc, d.id desc',
  distance: 'd.distance_m asc, d.id asc',
  '-distance': 'd.distance_m desc, d.id desc',
};

function toDive(row: DiveRow): DiveRecord {
  const { bbox_west: w, bbox_south: s, bbox_east: e, bbox_north: n } = row;
  return {
    id: row.id,
    projectId: row.project_id,
    logId: row.log_id,
    logFileName: row.original_file_name,
    diveNumber: row.dive_number,
    trackName: row.track_name,
    startTime: row.start_time,
    endTime: row.end_time,
    durationS: row.duration_s,
    fixCount: row.fix_count,
    maxDepthM: row.max_depth_m,
    distanceM: row.distance_m,
    bboxDeg: w === null || s === null || e === null || n === null ? null : [w, s, e, n],
    verdict: row.verdict,
    auditProfile: row.audit_profile,
    latestResultId: row.latest_result_id,
    summary: row.summary,
  };
}

function toResult(row: ResultRow): DiveResultRecord {
  return {
    id: row.id,
    diveId: row.dive_id,
    runId: row.run_id,
    verdict: row.verdict,
    auditProfile: row.audit_profile,
    resolveSetup: row.resolve_setup,
    auditSetup: row.audit_setup,
    summary: row.summary,
    report: row.report,
    resolveComparison: row.resolve_comparison,
    flaggedCount: row.flagged_count,
    createdAt: row.created_at,
  };
}

function jsonOrNull(value: unknown): string | null {
  return value === null || value === undefined ? null : JSON.stringify(value);
}

function timeOrNull(ms: number | null): Date | null {
  return ms === null || !Number.isFinite(ms) ? null : new Date(ms);
}

/** The dive's queried columns, taken from a result's summary. */
function latestColumns(result: NewDiveResult, resultId: string) {
  const s = result.summary;
  // A box across the antimeridian (west > east) is stored as the whole longitude band so that
  // the box index never misses it; lists still show the summary's own box.
  const bbox = s.bboxDeg;
  const crosses = bbox !== null && bbox[0] > bbox[2];
  return {
    start_time: timeOrNull(s.startTimeMs),
    end_time: timeOrNull(s.endTimeMs),
    duration_s: s.durationS,
    fix_count: s.fixCount,
    max_depth_m: s.maxDepthM,
    distance_m: s.distanceM,
    bbox_west: bbox === null ? null : crosses ? -180 : bbox[0],
    bbox_south: bbox === null ? null : bbox[1],
    bbox_east: bbox === null ? null : crosses ? 180 : bbox[2],
    bbox_north: bbox === null ? null : bbox[3],
    verdict: result.verdict,
    audit_profile: result.auditProfile,
    latest_result_id: resultId,
    summary: JSON.stringify(s),
  };
}

function trackRow(diveId: string, encoded: EncodedTrack) {
  return {
    dive_id: diveId,
    role: encoded.role,
    fix_count: encoded.fixCount,
    meta: JSON.stringify(encoded.meta),
    segment_starts: encoded.segmentStarts,
    source_lines: encoded.sourceLines,
    column_names: encoded.columnNames,
    fixes: encoded.fixes,
  };
}

async function insertResult(trx: Knex.Transaction, diveId: string, runId: string, result: NewDiveResult) {
  const [row] = await trx('dive_results')
    .insert({
      dive_id: diveId,
      run_id: runId,
      verdict: result.verdict,
      audit_profile: result.auditProfile,
      resolve_setup: jsonOrNull(result.resolveSetup),
      audit_setup: JSON.stringify(result.auditSetup),
      summary: JSON.stringify(result.summary),
      report: JSON.stringify(result.report),
      resolve_comparison: jsonOrNull(result.resolveComparison),
      flags: Buffer.from(result.flags.buffer, result.flags.byteOffset, result.flags.byteLength),
      flagged_count: result.flaggedCount,
    })
    .returning<{ id: string }[]>('id');
  if (row === undefined) throw new Error('dive result not stored');
  const findings = result.findings.map((f) => ({
    result_id: row.id,
    check: f.check,
    severity: f.severity,
    start_index: f.startIndex,
    end_index: f.endIndex,
    start_time: timeOrNull(f.startTimeMs),
    end_time: timeOrNull(f.endTimeMs),
    measured: Number.isFinite(f.measured) ? f.measured : null,
    limit: Number.isFinite(f.limit) ? f.limit : null,
    unit: f.unit,
    message: f.message,
  }));
  for (let i = 0; i < findings.length; i += 1000) await trx('dive_findings').insert(findings.slice(i, i + 1000));
  return row.id;
}

function searchText(fileName: string, trackName: string, result: NewDiveResult): string {
  const words = [fileName, trackName, result.auditProfile, ...new Set(result.findings.map((f) => f.check))];
  const text = words.join(' ');
  return `${text} ${text.replace(/[^\p{L}\p{N}]+/gu, ' ')}`;
}

const TRACK_HEAD_SQL = `select d.latest_result_id, d.dive_number, l.original_file_name, p.default_setup
  from dives d join logs l on l.id = d.log_id join projects p on p.id = d.project_id
  where d.id = ? and d.project_id = ? and p.organisation_id = ?`;

/** The PostgreSQL implementation. */
export function createKnexDiveStore(db: Knex): DiveStore {
  const base = () => db('dives as d').join('logs as l', 'l.id', 'd.log_id');
  return {
    async storeProcessed(runId, logId, projectId, dives) {
      return db.transaction(async (trx) => {
        const run: { status: string } | undefined = await trx('processing_runs')
          .where({ id: runId })
          .forUpdate()
          .first('status');
        if (run === undefined || run.status === 'done') return undefined;
        const log: { original_file_name: string } | undefined = await trx('logs')
          .where({ id: logId })
          .first('original_file_name');
        if (log === undefined) return undefined;
        // Dives of an earlier process run of the same log are replaced (their results go with them).
        await trx('dives').where({ log_id: logId }).delete();
        const ids: string[] = [];
        for (const dive of dives) {
          const trackName = dive.vehicle.name ?? dive.vehicle.id;
          const [row] = await trx('dives')
            .insert({
              project_id: projectId,
              log_id: logId,
              dive_number: dive.diveNumber,
              track_name: trackName,
              summary: JSON.stringify(dive.result.summary),
              fix_count: dive.vehicle.length,
              search_text: searchText(log.original_file_name, trackName, dive.result),
            })
            .returning<{ id: string }[]>('id');
          if (row === undefined) throw new Error('dive not stored');
          await trx('dive_tracks').insert(trackRow(row.id, encodeTrack(dive.vehicle)));
          if (dive.surface !== undefined && dive.surface.length > 0)
            await trx('dive_tracks').insert(trackRow(row.id, encodeTrack(dive.surface)));
          const resultId = await insertResult(trx, row.id, runId, dive.result);
          await trx('dives').where({ id: row.id }).update(latestColumns(dive.result, resultId));
          ids.push(row.id);
        }
        await trx('processing_runs')
          .where({ id: runId })
          .update({ status: 'done', reason: null, finished_at: trx.fn.now() });
        return ids;
      });
    },
    async storeReprocessed(runId, results) {
      return db.transaction(async (trx) => {
        const run: { status: string } | undefined = await trx('processing_runs')
          .where({ id: runId })
          .forUpdate()
          .first('status');
        if (run === undefined || run.status === 'done') return false;
        for (const { diveId, result } of results) {
          const resultId = await insertResult(trx, diveId, runId, result);
          await trx('dives')
            .where({ id: diveId })
            .update({ ...latestColumns(result, resultId), updated_at: trx.fn.now() });
        }
        await trx('processing_runs')
          .where({ id: runId })
          .update({ status: 'done', reason: null, finished_at: trx.fn.now() });
        return true;
      });
    },
    async list(query) {
      const filtered =
        'organisationId' in query
          ? base().whereIn('d.project_id', db('projects').select('id').where('organisation_id', query.organisationId))
          : base().where('d.project_id', query.projectId);
      if (query.logId !== undefined) filtered.where('d.log_id', query.logId);
      if (query.ids !== undefined) filtered.whereIn('d.id', query.ids);
      // A dive is in a time range when it overlaps it.
      if (query.from !== undefined) filtered.where('d.end_time', '>=', query.from);
      if (query.to !== undefined) filtered.where('d.start_time', '<=', query.to);
      if (query.verdicts !== undefined && query.verdicts.length > 0) filtered.whereIn('d.verdict', query.verdicts);
      if (query.minDepthM !== undefined) filtered.where('d.max_depth_m', '>=', query.minDepthM);
      if (query.maxDepthM !== undefined) filtered.where('d.max_depth_m', '<=', query.maxDepthM);
      if (query.text !== undefined && query.text.trim() !== '')
        filtered.whereRaw(`d.search @@ plainto_tsquery('simple', ?)`, [query.text]);
      if (query.bbox !== undefined) {
        const [w, s, e, n] = query.bbox;
        const boxes: Array<[number, number, number, number]> =
          w <= e
            ? [[w, s, e, n]]
            : [
                [w, s, 180, n],
                [-180, s, e, n],
              ];
        filtered.where((q) => {
          for (const b of boxes)
            q.orWhereRaw(
              'box(point(d.bbox_west, d.bbox_south), point(d.bbox_east, d.bbox_north)) && box(point(?, ?), point(?, ?))',
              b,
            );
        });
      }
      const [countRow] = await filtered.clone().count<{ count: string }[]>({ count: '*' });
      const rows: DiveRow[] = await filtered
        .select(DIVE_COLUMNS)
        .orderByRaw(SORT_SQL[query.sort])
        .limit(query.limit)
        .offset(query.offset);
      return { dives: rows.map(toDive), total: Number(countRow?.count ?? 0) };
    },
    async find(projectId, diveId) {
      const row: DiveRow | undefined = await base()
        .where({ 'd.project_id': projectId, 'd.id': diveId })
        .first(DIVE_COLUMNS);
      return row === undefined ? undefined : toDive(row);
    },
    async findWithProject(diveId) {
      const row:
        | (DiveRow & { organisation_id: string; project_name: string; site: string | null; default_crs: string | null })
        | undefined = await base()
        .join('projects as p', 'p.id', 'd.project_id')
        .where({ 'd.id': diveId })
        .first([...DIVE_COLUMNS, 'p.organisation_id', 'p.name as project_name', 'p.site', 'p.default_crs']);
      if (row === undefined) return undefined;
      return {
        dive: toDive(row),
        organisationId: row.organisation_id,
        projectName: row.project_name,
        site: row.site,
        defaultCrs: row.default_crs,
      };
    },
    async diveIdsOfLog(logId) {
      const rows: Array<{ id: string }> = await db('dives')
        .where({ log_id: logId })
        .orderBy('dive_number')
        .select('id');
      return rows.map((r) => r.id);
    },
    async trackHead(organisationId, projectId, diveId) {
      // Plain SQL: this read runs on every track download (the query builder costs more than the query).
      const { rows } = await db.raw<{
        rows: Array<{
          latest_result_id: string | null;
          dive_number: number;
          original_file_name: string;
          default_setup: unknown;
        }>;
      }>(TRACK_HEAD_SQL, [diveId, projectId, organisationId]);
      const row = rows[0];
      if (row === undefined) return undefined;
      return {
        latestResultId: row.latest_result_id,
        diveNumber: row.dive_number,
        logFileName: row.original_file_name,
        defaultSetup: row.default_setup,
      };
    },
    async tracks(diveId) {
      const rows: Array<{
        role: Track['role'];
        fix_count: number;
        meta: EncodedTrack['meta'];
        segment_starts: number[];
        source_lines: Buffer;
        column_names: EncodedTrack['columnNames'];
        fixes: Buffer;
      }> = await db('dive_tracks').where({ dive_id: diveId });
      const decoded = rows.map((r) =>
        decodeTrack({
          role: r.role,
          fixCount: r.fix_count,
          meta: r.meta,
          segmentStarts: r.segment_starts,
          sourceLines: r.source_lines,
          columnNames: r.column_names,
          fixes: r.fixes,
        }),
      );
      const vehicle = decoded.find((t) => t.role === 'vehicle');
      if (vehicle === undefined) return undefined;
      return { vehicle, surface: decoded.find((t) => t.role === 'surface') };
    },
    async results(diveId) {
      const rows: ResultRow[] = await db('dive_results')
        .where({ dive_id: diveId })
        .orderBy([
          { column: 'created_at', order: 'desc' },
          { column: 'id', order: 'desc' },
        ])
        .select(RESULT_COLUMNS);
      return rows.map(toResult);
    },
    async result(diveId, resultId) {
      const row: ResultRow | undefined = await db('dive_results')
        .where({ dive_id: diveId, id: resultId })
        .first(RESULT_COLUMNS);
      return row === undefined ? undefined : toResult(row);
    },
    async flags(resultId) {
      const row: { flags: Buffer } | undefined = await db('dive_results').where({ id: resultId }).first('flags');
      if (row === undefined) return undefined;
      const copy = new Uint8Array(row.flags);
      return new Uint16Array(copy.buffer, 0, copy.byteLength / 2);
    },
  };
}
