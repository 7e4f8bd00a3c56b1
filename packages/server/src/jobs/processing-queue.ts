import PgBoss from 'pg-boss';
import type { Logger } from 'pino';
import type { FailedAudit } from '../services/audit-notice-service.js';
import {
  auditSetupFromResolveSetup,
  PermanentProcessingError,
  type ProcessingDeps,
  type ProcessingHooks,
  performRun,
} from '../services/processing-service.js';
import type { RunRecord } from '../stores/processing-run-store.js';

/** The pg-boss queue processing runs go through. */
export const PROCESSING_QUEUE = 'leadline_processing';

/** What a processing job carries. */
export interface ProcessingJobData {
  runId: string;
  organisationId: string;
}

/** Retries and expiry of processing jobs. */
export interface ProcessingJobSettings {
  /** Further attempts after the first fails (default 3). */
  retryLimit: number;
  /** Seconds before the first retry; doubled each time with `retryBackoff` (default 5). */
  retryDelayS: number;
  /** A job active longer than this is taken as lost (its worker died) and retried, seconds (default 600). */
  expireInS: number;
}

/** Sends runs to the workers. */
export interface ProcessingQueue {
  enqueue(run: RunRecord, organisationId: string): Promise<void>;
}

const DEFAULT_SETTINGS: ProcessingJobSettings = { retryLimit: 3, retryDelayS: 5, expireInS: 600 };

/** A started pg-boss on the application's database (schema `pgboss`), with the processing queue created. */
export async function startJobBoss(
  databaseUrl: string,
  options: { logger?: Logger; maintenanceIntervalS?: number } = {},
): Promise<PgBoss> {
  const boss = new PgBoss({
    connectionString: databaseUrl,
    max: 4,
    application_name: 'leadline-jobs',
    ...(options.maintenanceIntervalS === undefined ? {} : { maintenanceIntervalSeconds: options.maintenanceIntervalS }),
  });
  boss.on('error', (error) => options.logger?.error({ err: error }, 'job queue error'));
  await boss.start();
  await boss.createQueue(PROCESSING_QUEUE);
  return boss;
}

/**
 * The queue side: marks nothing itself, only sends `{ runId, organisationId }` with the retry and
 * expiry settings, records the job id on the run and wakes a worker in this process at once.
 */
export function createProcessingQueue(
  boss: PgBoss,
  store: { setJob(runId: string, jobId: string): Promise<void> },
  settings: Partial<ProcessingJobSettings> = {},
  wake?: () => void,
): ProcessingQueue {
  const s = { ...DEFAULT_SETTINGS, ...settings };
  return {
    async enqueue(run, organisationId) {
      const data: ProcessingJobData = { runId: run.id, organisationId };
      const jobId = await boss.send(PROCESSING_QUEUE, data, {
        retryLimit: s.retryLimit,
        retryDelay: s.retryDelayS,
        retryBackoff: true,
        expireInSeconds: s.expireInS,
      });
      if (jobId !== null) await store.setJob(run.id, jobId);
      wake?.();
    },
  };
}

/** A running worker. */
export interface ProcessingWorker {
  /** Settles when the worker takes jobs (its threads have loaded); rejects when it cannot. */
  ready(): Promise<void>;
  /** Wakes the worker to fetch at once (after a send from the same process). */
  wake(): void;
  stop(): Promise<void>;
}

/**
 * Works processing jobs: one run at a time per worker. A permanent failure (unreadable log,
 * unknown profile) fails the run at once with its reason; any other error is retried with backoff
 * by pg-boss, the run going back to `queued` with the reason until the last attempt fails it.
 * Runs left `queued` without a job (the server stopped between storing and sending) are sent again,
 * and logs that never had a run (demo data, logs archived before processing) get their first one.
 */
export async function startProcessingWorker(
  boss: PgBoss,
  deps: ProcessingDeps,
  options: {
    logger?: Logger;
    hooks?: ProcessingHooks;
    pollingIntervalS?: number;
    settings?: Partial<ProcessingJobSettings>;
    /** Tells the project's watchers about a dive that failed its audit (after the run is stored). */
    notify?: (audit: FailedAudit) => Promise<unknown>;
    /** Jobs are taken once this settles (worker threads loaded), so no job's expiry runs while code loads. */
    takeJobsAfter?: Promise<unknown>;
  } = {},
): Promise<ProcessingWorker> {
  const log = options.logger;
  let workerId: string | undefined;
  const subscribe = () =>
    boss.work<ProcessingJobData>(
      PROCESSING_QUEUE,
      { includeMetadata: true, batchSize: 1, pollingIntervalSeconds: options.pollingIntervalS ?? 2 },
      async (jobs) => {
        for (const job of jobs) {
          const { runId, organisationId } = job.data;
          try {
            const started = Date.now();
            const outcome = await performRun(deps, runId, organisationId, options.hooks);
            log?.info({ runId, status: outcome.status, ms: Date.now() - started }, 'processing run finished');
            if (outcome.status === 'done' && options.notify !== undefined)
              for (const audit of outcome.failedAudits)
                await options
                  .notify(audit)
                  .catch((error: unknown) => log?.warn({ runId, err: error }, 'failed-audit notice not sent'));
          } catch (error) {
            const message = error instanceof Error ? error.message : String(error);
            if (error instanceof PermanentProcessingError) {
              await deps.runs.fail(runId, message);
              log?.warn({ runId, reason: message }, 'processing run failed');
              continue;
            }
            if (job.retryCount >= job.retryLimit)
              await deps.runs.fail(runId, `gave up after ${job.retryCount + 1} attempts: ${message}`);
            else await deps.runs.requeue(runId, `attempt ${job.retryCount + 1} failed, will retry: ${message}`);
            log?.error({ runId, err: error }, 'processing attempt failed');
            throw error;
          }
        }
        // pg-boss waits a polling interval even after a fetch that found work; fetch again at once.
        if (workerId !== undefined) boss.notifyWorker(workerId);
      },
    );
  let stopped = false;
  const taking = (async () => {
    await options.takeJobsAfter;
    if (stopped) return;
    workerId = await subscribe();
    if (stopped) await boss.offWork(PROCESSING_QUEUE);
  })();
  // A failure to start taking jobs is logged and shown by `ready` (it rejects).
  taking.catch((error: unknown) => log?.error({ err: error }, 'the processing worker could not start'));
  const queue = createProcessingQueue(boss, deps.runs, options.settings);
  for (const { run, organisationId } of await deps.runs.queuedWithoutJob()) await queue.enqueue(run, organisationId);
  for (const log of await deps.runs.logsWithoutRuns(10_000)) {
    const run = await deps.runs.create({
      projectId: log.projectId,
      logId: log.logId,
      kind: 'process',
      auditProfile: log.auditProfile,
      resolveSetup: null,
      auditSetup: auditSetupFromResolveSetup(log.defaultSetup),
      requestedBy: null,
    });
    await queue.enqueue(run, log.organisationId);
  }
  // A run whose worker died on its last attempt is never handed to a handler again: pg-boss fails the
  // job on expiry. Such runs are marked failed here (at start and every minute).
  const settings = { ...DEFAULT_SETTINGS, ...options.settings };
  const reap = async () => {
    for (const run of await deps.runs.stalled(settings.expireInS)) {
      if (run.jobId === null) continue;
      const job = await boss.getJobById(PROCESSING_QUEUE, run.jobId, { includeArchive: true });
      if (job === null || job.state === 'failed' || job.state === 'cancelled')
        await deps.runs.fail(
          run.id,
          `the worker stopped mid-job on every attempt (${run.attempts}); reprocess the log`,
        );
    }
  };
  await reap();
  const reaper = setInterval(() => {
    reap().catch((error: unknown) => log?.warn({ err: error }, 'checking stalled runs failed'));
  }, 60_000);
  reaper.unref();
  return {
    ready: () => taking,
    wake: () => {
      if (workerId !== undefined) boss.notifyWorker(workerId);
    },
    stop: async () => {
      // Does not wait for threads still loading: the worker then never starts taking jobs.
      stopped = true;
      clearInterval(reaper);
      if (workerId !== undefined) await boss.offWork(PROCESSING_QUEUE);
    },
  };
}
