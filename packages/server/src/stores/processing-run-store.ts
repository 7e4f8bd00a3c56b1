import type { Knex } from 'knex';

/** Where a run is: waiting for a worker, being worked on, finished, or given up with a reason. */
export type RunStatus = 'queued' | 'processing' | 'done' | 'failed';

/** One processing of a log, or of one dive of it, with the parameters it ran with. */
export interface RunRecord {
  id: string;
  projectId: string;
  logId: string;
  /** Set when only this dive is reprocessed. */
  diveId: string | null;
  kind: 'process' | 'reprocess';
  status: RunStatus;
  reason: string | null;
  auditProfile: string;
  resolveSetup: unknown;
  auditSetup: Record<string, unknown>;
  attempts: number;
  jobId: string | null;
  requestedBy: string | null;
  createdAt: Date;
  startedAt: Date | null;
  finishedAt: Date | null;
}

/** What a new run is told. */
export interface NewRun {
  projectId: string;
  logId: string;
  diveId?: string | null;
  kind: 'process' | 'reprocess';
  auditProfile: string;
  resolveSetup: unknown;
  auditSetup: Record<string, unknown>;
  requestedBy: string | null;
}

/** The history of processing runs and their status. */
export interface ProcessingRunStore {
  create(run: NewRun): Promise<RunRecord>;
  setJob(runId: string, jobId: string): Promise<void>;
  find(runId: string): Promise<RunRecord | undefined>;
  /** A log's runs, newest first. */
  listForLog(logId: string): Promise<RunRecord[]>;
  /** Marks the run taken by a worker: status `processing`, one more attempt. */
  start(runId: string): Promise<RunRecord | undefined>;
  /** Back to `queued` after a failed attempt that will be retried, with why. */
  requeue(runId: string, reason: string): Promise<void>;
  fail(runId: string, reason: string): Promise<void>;
  /** Runs still `queued` that never reached the job queue (the server stopped between the two). */
  queuedWithoutJob(): Promise<Array<{ run: RunRecord; organisationId: string }>>;
  /** Runs marked `processing` longer than `olderThanS` seconds (their worker may have died). */
  stalled(olderThanS: number): Promise<RunRecord[]>;
  /** Logs that never had a run (archived before processing existed, or loaded as demo data), oldest first. */
  logsWithoutRuns(
    limit: number,
  ): Promise<
    Array<{ logId: string; projectId: string; organisationId: string; auditProfile: string; defaultSetup: unknown }>
  >;
}

interface RunRow {
  id: string;
  project_id: string;
  log_id: string;
  dive_id: string | null;
  kind: 'process' | 'reprocess';
  status: RunStatus;
  reason: string | null;
  audit_profile: string;
  resolve_setup: unknown;
  audit_setup: Record<string, unknown>;
  attempts: number;
  job_id: string | null;
  requested_by: string | null;
  created_at: Date;
  started_at: Date | null;
  finished_at: Date | null;
}

/** Maps a `processing_runs` row. */
export function toRunRecord(row: RunRow): RunRecord {
  return {
    id: row.id,
    projectId: row.project_id,
    logId: row.log_id,
    diveId: row.dive_id,
    kind: row.kind,
    status: row.status,
    reason: row.reason,
    auditProfile: row.audit_profile,
    resolveSetup: row.resolve_setup,
    auditSetup: row.audit_setup,
    attempts: row.attempts,
    jobId: row.job_id,
    requestedBy: row.requested_by,
    createdAt: row.created_at,
    startedAt: row.started_at,
    finishedAt: row.finished_at,
  };
}

/** The PostgreSQL implementation. */
export function createKnexProcessingRunStore(db: Knex): ProcessingRunStore {
  return {
    async create(run) {
      const [row] = await db('processing_runs')
        .insert({
          project_id: run.projectId,
          log_id: run.logId,
          dive_id: run.diveId ?? null,
          kind: run.kind,
          audit_profile: run.auditProfile,
          resolve_setup:
            run.resolveSetup === null || run.resolveSetup === undefined ? null : JSON.stringify(run.resolveSetup),
          audit_setup: JSON.stringify(run.auditSetup),
          requested_by: run.requestedBy,
        })
        .returning<RunRow[]>('*');
      if (row === undefined) throw new Error('processing run not created');
      return toRunRecord(row);
    },
    async setJob(runId, jobId) {
      await db('processing_runs').where({ id: runId }).update({ job_id: jobId });
    },
    async find(runId) {
      const row: RunRow | undefined = await db('processing_runs').where({ id: runId }).first();
      return row === undefined ? undefined : toRunRecord(row);
    },
    async listForLog(logId) {
      const rows: RunRow[] = await db('processing_runs')
        .where({ log_id: logId })
        .orderBy([
          { column: 'created_at', order: 'desc' },
          { column: 'id', order: 'desc' },
        ]);
      return rows.map(toRunRecord);
    },
    async start(runId) {
      const [row] = await db('processing_runs')
        .where({ id: runId })
        .whereIn('status', ['queued', 'processing'])
        .update({ status: 'processing', started_at: db.fn.now(), attempts: db.raw('attempts + 1'), reason: null })
        .returning<RunRow[]>('*');
      return row === undefined ? undefined : toRunRecord(row);
    },
    async requeue(runId, reason) {
      await db('processing_runs')
        .where({ id: runId })
        .whereNot({ status: 'done' })
        .update({ status: 'queued', reason });
    },
    async fail(runId, reason) {
      await db('processing_runs')
        .where({ id: runId })
        .whereNot({ status: 'done' })
        .update({ status: 'failed', reason, finished_at: db.fn.now() });
    },
    async queuedWithoutJob() {
      const rows: Array<RunRow & { organisation_id: string }> = await db('processing_runs as r')
        .join('projects as p', 'p.id', 'r.project_id')
        .where({ 'r.status': 'queued' })
        .whereNull('r.job_id')
        // Not the runs an upload is sending right now.
        .where('r.created_at', '<', db.raw(`now() - interval '30 seconds'`))
        .select('r.*', 'p.organisation_id');
      return rows.map((row) => ({ run: toRunRecord(row), organisationId: row.organisation_id }));
    },
    async stalled(olderThanS) {
      const rows: RunRow[] = await db('processing_runs')
        .where({ status: 'processing' })
        .where('started_at', '<', db.raw(`now() - make_interval(secs => ?)`, [olderThanS]));
      return rows.map(toRunRecord);
    },
    async logsWithoutRuns(limit) {
      const rows: Array<{
        log_id: string;
        project_id: string;
        organisation_id: string;
        audit_profile: string;
        default_setup: unknown;
      }> = await db('logs as l')
        .join('projects as p', 'p.id', 'l.project_id')
        .whereNotExists(db('processing_runs as r').whereRaw('r.log_id = l.id').select(db.raw('1')))
        .orderBy('l.uploaded_at')
        .limit(limit)
        .select('l.id as log_id', 'l.project_id', 'p.organisation_id', 'p.audit_profile', 'p.default_setup');
      return rows.map((r) => ({
        logId: r.log_id,
        projectId: r.project_id,
        organisationId: r.organisation_id,
        auditProfile: r.audit_profile,
        defaultSetup: r.default_setup,
      }));
    },
  };
}
