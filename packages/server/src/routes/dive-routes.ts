import { resolveSetupSchema } from '@leadline/core';
import yazl from 'yazl';
import { z } from 'zod';
import { requireMembership } from '../http/authorise.js';
import { AppError } from '../http/errors.js';
import { defineRoute, type RouteSpec } from '../http/route-table.js';
import { sendPreparedFile } from '../http/send-prepared-file.js';
import {
  compareDiveResults,
  type DiveDeps,
  diveFileName,
  downloadDiveReport,
  downloadDiveTrack,
  getDive,
  listDives,
  listOrganisationDives,
  listRuns,
  reprocessDive,
  reprocessLog,
} from '../services/dive-service.js';
import { getDiveView } from '../services/dive-view-service.js';
import { attachment, checkOutputCrs, TRACK_FORMATS } from '../services/track-output.js';
import { DIVE_SORTS, type DiveQuery, type DiveRecord, type DiveResultRecord } from '../stores/dive-store.js';
import type { RunRecord } from '../stores/processing-run-store.js';
import { OrganisationParams, TimestampSchema, UuidSchema } from './schemas.js';

const ProjectParams = OrganisationParams.extend({ projectId: UuidSchema });
const DiveParams = ProjectParams.extend({ diveId: UuidSchema });
const LogParams = ProjectParams.extend({ logId: UuidSchema });

const VerdictSchema = z.enum(['pass', 'warn', 'fail']);

const BboxSchema = z
  .string()
  .regex(/^-?\d+(\.\d+)?(,-?\d+(\.\d+)?){3}$/, 'four numbers: west,south,east,north')
  .transform((text) => text.split(',').map(Number) as [number, number, number, number])
  .refine(
    ([w, s, e, n]) => [w, e].every((x) => x >= -180 && x <= 180) && s >= -90 && n <= 90 && s <= n,
    'west and east within ±180°, south ≤ north within ±90°',
  )
  .describe('west,south,east,north in WGS 84 degrees; west > east crosses the antimeridian');

const DiveFilterShape = {
  from: z.iso.datetime({ offset: true }).optional().describe('Dives that end at or after this time'),
  to: z.iso.datetime({ offset: true }).optional().describe('Dives that start at or before this time'),
  bbox: BboxSchema.optional(),
  verdict: z
    .string()
    .transform((text, ctx) => {
      const parts = text.split(',').map((v) => v.trim());
      for (const part of parts)
        if (!VerdictSchema.safeParse(part).success) {
          ctx.addIssue({ code: 'custom', message: `"${part}" is not a verdict (pass, warn, fail)` });
          return z.NEVER;
        }
      return parts as Array<z.infer<typeof VerdictSchema>>;
    })
    .optional()
    .describe('Comma-separated verdicts, e.g. warn,fail'),
  minDepthM: z.coerce.number().finite().optional().describe('Maximum depth at least this, metres'),
  maxDepthM: z.coerce.number().finite().optional().describe('Maximum depth at most this, metres'),
  q: z.string().max(200).optional().describe('Words in the log file name, dive name, profile or finding checks'),
  logId: UuidSchema.optional(),
  sort: z.enum(DIVE_SORTS).default('-startTime'),
};

const { logId: _logId, ...OrganisationFilterShape } = DiveFilterShape;

const OrganisationDiveListQuery = z.object({
  ...OrganisationFilterShape,
  limit: z.coerce.number().int().min(1).max(100).default(20),
  offset: z.coerce.number().int().min(0).max(1_000_000).default(0),
});

const DiveListQuery = z.object({
  ...DiveFilterShape,
  limit: z.coerce.number().int().min(1).max(500).default(50),
  offset: z.coerce.number().int().min(0).max(1_000_000).default(0),
});

const ArchiveQuery = z.object({
  ...DiveFilterShape,
  ids: z
    .string()
    .transform((text) => text.split(',').map((v) => v.trim()))
    // 300 ids keep the URL within Node's 16 KiB header limit; larger selections go by filter.
    .pipe(z.array(UuidSchema).min(1).max(300))
    .optional()
    .describe('Comma-separated dive ids (at most 300): the selection'),
  format: z.enum(TRACK_FORMATS).default('gpx'),
  crs: z
    .string()
    .max(20)
    .optional()
    .describe("CSV only: also write coordinates in EPSG:<code>, or utm (each dive's zone chosen from its data)"),
  limit: z.coerce.number().int().min(1).max(1000).default(1000),
});

const TrackQuery = z.object({
  format: z.enum(TRACK_FORMATS).default('gpx'),
  variant: z
    .enum(['raw', 'cleaned', 'resolved'])
    .default('raw')
    .describe(
      "raw: as logged; cleaned: smoothed after the latest audit; resolved: re-solved with the latest run's setup or the project's",
    ),
  crs: z.string().max(20).optional().describe('CSV only: also write coordinates in EPSG:<code>, or utm'),
});

const ReportQuery = z.object({
  format: z.enum(['json', 'md', 'html']).default('json'),
  resultId: UuidSchema.optional().describe("A former run's result; the latest by default"),
});

const ResultParams = DiveParams.extend({ resultId: UuidSchema });

const DisplacementQuery = z.object({
  against: UuidSchema.optional().describe('The result to compare with; by default the one just before'),
});

/** Metres; null when no fix had a position in both runs (JSON has no NaN). */
const metres = z.number().nullable();

const DisplacementSchema = z.object({
  resultId: UuidSchema,
  againstResultId: UuidSchema,
  fixCount: z.number().int().describe('Fixes of the stored track'),
  comparedCount: z.number().int().describe('Fixes with a position in both runs'),
  medianM: metres,
  p95M: metres,
  maxM: metres,
  meanM: metres,
  rmsM: metres,
});

const ReprocessBody = z
  .object({
    auditProfile: z
      .string()
      .regex(/^[a-z][a-z0-9-]{0,63}$/, 'a profile name such as inspection-rov')
      .optional()
      .describe("The audit profile; the project's by default"),
    setup: resolveSetupSchema
      .nullable()
      .optional()
      .describe('A re-solve setup: positions are re-solved with it before the audit; none by default'),
    auditSetup: z.record(z.string(), z.unknown()).optional().describe("The audit setup; by default the setup's draft"),
  })
  .strict();

const DiveSchema = z.object({
  id: UuidSchema,
  logId: UuidSchema,
  logFileName: z.string(),
  diveNumber: z.number().int(),
  trackName: z.string(),
  startTime: TimestampSchema.nullable(),
  endTime: TimestampSchema.nullable(),
  durationS: z.number().nullable(),
  fixCount: z.number().int(),
  maxDepthM: z.number().nullable(),
  distanceM: z.number().nullable(),
  bboxDeg: z.array(z.number()).length(4).nullable(),
  verdict: VerdictSchema.nullable(),
  auditProfile: z.string().nullable(),
  latestResultId: UuidSchema.nullable(),
  summary: z.record(z.string(), z.unknown()).describe("The latest run's summary (summariseDive)"),
});

const ResultSchema = z.object({
  id: UuidSchema,
  runId: UuidSchema,
  verdict: VerdictSchema,
  auditProfile: z.string(),
  resolveSetup: z.unknown(),
  auditSetup: z.record(z.string(), z.unknown()),
  flaggedCount: z.number().int(),
  findingCounts: z.record(z.string(), z.number()),
  resolveComparison: z.unknown(),
  createdAt: TimestampSchema,
});

const RunSchema = z.object({
  id: UuidSchema,
  logId: UuidSchema,
  diveId: UuidSchema.nullable(),
  kind: z.enum(['process', 'reprocess']),
  status: z.enum(['queued', 'processing', 'done', 'failed']),
  reason: z.string().nullable(),
  auditProfile: z.string(),
  resolveSetup: z.unknown(),
  auditSetup: z.record(z.string(), z.unknown()),
  attempts: z.number().int(),
  createdAt: TimestampSchema,
  startedAt: TimestampSchema.nullable(),
  finishedAt: TimestampSchema.nullable(),
});

function diveJson(dive: DiveRecord) {
  const { projectId: _p, ...rest } = dive;
  return rest;
}

function resultJson(result: DiveResultRecord) {
  return {
    id: result.id,
    runId: result.runId,
    verdict: result.verdict,
    auditProfile: result.auditProfile,
    resolveSetup: result.resolveSetup,
    auditSetup: result.auditSetup,
    flaggedCount: result.flaggedCount,
    findingCounts: result.report.findingCounts,
    resolveComparison: result.resolveComparison,
    createdAt: result.createdAt,
  };
}

function runJson(run: RunRecord) {
  const { projectId: _p, jobId: _j, requestedBy: _r, ...rest } = run;
  return rest;
}

function toQuery(projectId: string, q: z.output<typeof DiveListQuery>): DiveQuery {
  return {
    projectId,
    logId: q.logId,
    from: q.from === undefined ? undefined : new Date(q.from),
    to: q.to === undefined ? undefined : new Date(q.to),
    bbox: q.bbox,
    verdicts: q.verdict,
    minDepthM: q.minDepthM,
    maxDepthM: q.maxDepthM,
    text: q.q,
    sort: q.sort,
    limit: q.limit,
    offset: q.offset,
  };
}

/** Dives of a project: lists, one dive with its history, track and report downloads, reprocessing, the zip. */
export function createDiveRoutes(deps: DiveDeps): RouteSpec[] {
  const membership = deps.membership;
  return [
    ...(membership === undefined
      ? []
      : [
          defineRoute({
            method: 'get',
            path: '/dives/:diveId',
            summary:
              "One dive as the web's dive page draws it: audited fixes as columns, per-fix severity, findings, summary, S-44 shares",
            tag: 'Dives',
            access: 'signed-in',
            params: z.object({ diveId: UuidSchema }),
            responses: {
              200: { description: 'The dive with its fixes', schema: z.record(z.string(), z.unknown()) },
            },
            async handler({ params, auth }, _req, res) {
              res.json(await getDiveView({ dives: deps.dives, membership }, auth, params.diveId));
            },
          }),
        ]),
    defineRoute({
      method: 'get',
      path: '/organisations/:organisationId/dives',
      summary:
        "Dives of every project of the organisation (recent ones, those needing attention), filtered like a project's list",
      tag: 'Dives',
      access: 'viewer',
      params: OrganisationParams,
      query: OrganisationDiveListQuery,
      responses: {
        200: {
          description: 'One page of dives, each with its project id, and the total',
          schema: z.object({
            dives: z.array(DiveSchema.extend({ projectId: UuidSchema })),
            total: z.number().int(),
            limit: z.number().int(),
            offset: z.number().int(),
          }),
        },
      },
      async handler({ query, auth }, _req, res) {
        const me = requireMembership(auth);
        const { projectId: _p, ...filters } = toQuery('', query);
        const { dives, total } = await listOrganisationDives(deps, { ...filters, organisationId: me.organisationId });
        res.json({
          dives: dives.map((d) => ({ ...diveJson(d), projectId: d.projectId })),
          total,
          limit: query.limit,
          offset: query.offset,
        });
      },
    }),
    defineRoute({
      method: 'get',
      path: '/organisations/:organisationId/projects/:projectId/dives',
      summary: "The project's dives, filtered by time, box, verdict, depth and text, sorted and paged",
      tag: 'Dives',
      access: 'viewer',
      params: ProjectParams,
      query: DiveListQuery,
      responses: {
        200: {
          description: 'One page of dives and the total',
          schema: z.object({
            dives: z.array(DiveSchema),
            total: z.number().int(),
            limit: z.number().int(),
            offset: z.number().int(),
          }),
        },
      },
      async handler({ params, query, auth }, _req, res) {
        const me = requireMembership(auth);
        const { dives, total } = await listDives(deps, me.organisationId, toQuery(params.projectId, query));
        res.json({ dives: dives.map(diveJson), total, limit: query.limit, offset: query.offset });
      },
    }),
    defineRoute({
      method: 'get',
      path: '/organisations/:organisationId/projects/:projectId/dives/:diveId',
      summary: 'One dive: its latest result, its findings and the history of its runs',
      tag: 'Dives',
      access: 'viewer',
      params: DiveParams,
      responses: {
        200: {
          description: 'The dive',
          schema: z.object({
            dive: DiveSchema,
            findings: z.array(z.record(z.string(), z.unknown())),
            results: z.array(ResultSchema),
          }),
        },
      },
      async handler({ params, auth }, _req, res) {
        const { dive, results } = await getDive(deps, {
          organisationId: requireMembership(auth).organisationId,
          projectId: params.projectId,
          diveId: params.diveId,
        });
        const latest = results.find((r) => r.id === dive.latestResultId);
        res.json({
          dive: diveJson(dive),
          findings: latest?.report.findings ?? [],
          results: results.map(resultJson),
        });
      },
    }),
    defineRoute({
      method: 'get',
      path: '/organisations/:organisationId/projects/:projectId/dives/:diveId/track',
      summary: "A dive's track as GPX, GeoJSON, CSV (any CRS) or KML; raw, cleaned or re-solved",
      tag: 'Dives',
      access: 'viewer',
      params: DiveParams,
      query: TrackQuery,
      responses: {
        200: {
          description:
            'The track file, as an attachment; gzipped when accepted; a strong ETag, and 304 when If-None-Match holds it',
          contentType: 'application/octet-stream',
        },
        304: { description: 'Not modified: If-None-Match names the ETag of these bytes' },
        422: { description: 'A CRS with a format other than CSV, an unknown CRS, or no re-solve setup' },
      },
      async handler({ params, query, auth }, req, res) {
        const file = await downloadDiveTrack(deps, {
          organisationId: requireMembership(auth).organisationId,
          projectId: params.projectId,
          diveId: params.diveId,
          format: query.format,
          variant: query.variant,
          crs: query.crs,
        });
        if (file.crsNote !== undefined)
          res.setHeader('X-Leadline-Crs-Note', file.crsNote.replace(/[^\x20-\x7e]/g, '?'));
        await sendPreparedFile(req, res, file, attachment(file.fileName));
      },
    }),
    defineRoute({
      method: 'get',
      path: '/organisations/:organisationId/projects/:projectId/dives/:diveId/report',
      summary: "A dive's audit report as JSON, Markdown or HTML (the latest run's, or a named result's)",
      tag: 'Dives',
      access: 'viewer',
      params: DiveParams,
      query: ReportQuery,
      responses: { 200: { description: 'The report, as an attachment', contentType: 'application/octet-stream' } },
      async handler({ params, query, auth }, _req, res) {
        const file = await downloadDiveReport(deps, {
          organisationId: requireMembership(auth).organisationId,
          projectId: params.projectId,
          diveId: params.diveId,
          format: query.format,
          ...(query.resultId === undefined ? {} : { resultId: query.resultId }),
        });
        res.setHeader('Content-Type', file.contentType);
        res.setHeader('Content-Disposition', attachment(file.fileName));
        res.send(file.text);
      },
    }),
    defineRoute({
      method: 'post',
      path: '/organisations/:organisationId/projects/:projectId/dives/:diveId/reprocess',
      summary: 'Reprocess one dive with another audit profile or setup (re-solve); kept as a new run',
      tag: 'Dives',
      access: 'editor',
      params: DiveParams,
      body: ReprocessBody,
      responses: {
        202: { description: 'Queued', schema: z.object({ run: RunSchema }) },
        422: { description: 'Unknown profile or invalid setup' },
      },
      async handler({ params, body, auth }, _req, res) {
        const me = requireMembership(auth);
        const run = await reprocessDive(deps, {
          organisationId: me.organisationId,
          projectId: params.projectId,
          diveId: params.diveId,
          actorUserId: me.userId,
          request: body,
        });
        res.status(202).json({ run: runJson(run) });
      },
    }),
    defineRoute({
      method: 'get',
      path: '/organisations/:organisationId/projects/:projectId/dives/:diveId/results/:resultId/displacement',
      summary:
        "How far a run moved the dive's positions from another run (by default the one before): horizontal geodesic distances per fix, summarised",
      tag: 'Dives',
      access: 'viewer',
      params: ResultParams,
      query: DisplacementQuery,
      responses: {
        200: { description: 'Median, 95th percentile, maximum, mean and RMS in metres', schema: DisplacementSchema },
        404: { description: 'No such result, or the first run with nothing before it' },
      },
      async handler({ params, query, auth }, _req, res) {
        const found = await compareDiveResults(deps, {
          organisationId: requireMembership(auth).organisationId,
          projectId: params.projectId,
          diveId: params.diveId,
          resultId: params.resultId,
          ...(query.against === undefined ? {} : { againstResultId: query.against }),
        });
        const m = found.movement;
        const finite = (v: number) => (Number.isFinite(v) ? v : null);
        res.json({
          resultId: found.resultId,
          againstResultId: found.againstResultId,
          fixCount: found.fixCount,
          comparedCount: m.comparedCount,
          medianM: finite(m.medianM),
          p95M: finite(m.p95M),
          maxM: finite(m.maxM),
          meanM: finite(m.meanM),
          rmsM: finite(m.rmsM),
        });
      },
    }),
    defineRoute({
      method: 'get',
      path: '/organisations/:organisationId/projects/:projectId/logs/:logId/runs',
      summary: "A log's processing runs, newest first: status (queued, processing, done, failed), reason, parameters",
      tag: 'Dives',
      access: 'viewer',
      params: LogParams,
      responses: { 200: { description: 'Runs', schema: z.object({ runs: z.array(RunSchema) }) } },
      async handler({ params, auth }, _req, res) {
        const runs = await listRuns(deps, {
          organisationId: requireMembership(auth).organisationId,
          projectId: params.projectId,
          logId: params.logId,
        });
        res.json({ runs: runs.map(runJson) });
      },
    }),
    defineRoute({
      method: 'post',
      path: '/organisations/:organisationId/projects/:projectId/logs/:logId/reprocess',
      summary:
        'Reprocess every dive of a log with another audit profile or setup (re-solve), or read and split a log whose processing failed again; kept as a new run',
      tag: 'Dives',
      access: 'editor',
      params: LogParams,
      body: ReprocessBody,
      responses: {
        202: { description: 'Queued', schema: z.object({ run: RunSchema }) },
        409: { description: "The log's last run is still queued or processing" },
        422: { description: 'Unknown profile or invalid setup' },
      },
      async handler({ params, body, auth }, _req, res) {
        const me = requireMembership(auth);
        const run = await reprocessLog(deps, {
          organisationId: me.organisationId,
          projectId: params.projectId,
          logId: params.logId,
          actorUserId: me.userId,
          request: body,
        });
        res.status(202).json({ run: runJson(run) });
      },
    }),
    defineRoute({
      method: 'get',
      path: '/organisations/:organisationId/projects/:projectId/dive-archive',
      summary: "The project's dives (filtered like the list, or a selection by ids) as one streamed zip of track files",
      tag: 'Dives',
      access: 'viewer',
      params: ProjectParams,
      query: ArchiveQuery,
      responses: {
        200: {
          description: 'A zip with one track file per dive (and crs-notes.txt when a CRS was applied)',
          contentType: 'application/zip',
        },
        422: { description: 'A CRS with a format other than CSV, or a CRS Leadline cannot run' },
      },
      async handler({ params, query, auth }, _req, res) {
        const me = requireMembership(auth);
        checkOutputCrs(query.format, query.crs);
        const { dives } = await listDives(deps, me.organisationId, {
          ...toQuery(params.projectId, { ...query, offset: 0 }),
          ids: query.ids,
        });
        if (dives.length === 0) throw new AppError('not-found', 'No dive matches; nothing to put in a zip.');
        const zip = new yazl.ZipFile();
        res.setHeader('Content-Type', 'application/zip');
        res.setHeader('Content-Disposition', attachment(`dives-${query.format}.zip`));
        zip.outputStream.pipe(res);
        // One dive at a time: only one track is in memory while the zip streams out. Once the zip
        // has started no error body can follow, so a failure cuts the response (the client sees a broken zip).
        const used = new Set<string>();
        const crsNotes: string[] = [];
        try {
          for (const dive of dives) {
            const file = await downloadDiveTrack(deps, {
              organisationId: me.organisationId,
              projectId: params.projectId,
              diveId: dive.id,
              format: query.format,
              variant: 'raw',
              crs: query.crs,
            });
            let name = file.fileName;
            if (used.has(name)) name = `${diveFileName(dive, 'raw')}-${dive.id.slice(0, 8)}.${query.format}`;
            used.add(name);
            if (file.crsNote !== undefined) crsNotes.push(`${name}: ${file.crsNote}`);
            zip.addBuffer(file.body, name, { mtime: dive.startTime ?? new Date(0) });
          }
        } catch (error) {
          res.destroy(error instanceof Error ? error : new Error(String(error)));
          return;
        }
        if (crsNotes.length > 0) zip.addBuffer(Buffer.from(`${crsNotes.join('\n')}\n`), 'crs-notes.txt');
        zip.end();
        await new Promise<void>((resolve, reject) => {
          res.on('finish', resolve);
          res.on('close', resolve);
          zip.outputStream.on('error', reject);
        });
      },
    }),
  ];
}
