import type { Knex } from 'knex';
import type { Logger } from 'pino';
import type { Mailer } from '../mail/mailer.js';
import { type FailedAudit, notifyFailedAudit } from '../services/audit-notice-service.js';
import type { ProcessingHooks } from '../services/processing-service.js';
import { createKnexDiveStore } from '../stores/dive-store.js';
import { createKnexLogStore } from '../stores/log-store.js';
import { createKnexProcessingRunStore } from '../stores/processing-run-store.js';
import { createKnexProjectStore } from '../stores/project-store.js';
import {
  createProcessingQueue,
  type ProcessingJobSettings,
  type ProcessingQueue,
  type ProcessingWorker,
  startJobBoss,
  startProcessingWorker,
} from './processing-queue.js';
import { createThreadCompute } from './processing-threads.js';

/** The job queue of a process, with its worker when it runs one. */
export interface Processing {
  queue: ProcessingQueue;
  worker: ProcessingWorker | undefined;
  /** Settles when this process's worker takes jobs (at once without one). */
  ready(): Promise<void>;
  stop(): Promise<void>;
}

/**
 * Starts pg-boss on the application's database, and a processing worker unless `worker` is false
 * (the server runs one by default; `npm run worker` runs one alone).
 */
export async function startProcessing(options: {
  databaseUrl: string;
  db: Knex;
  logger?: Logger;
  worker?: boolean;
  hooks?: ProcessingHooks;
  settings?: Partial<ProcessingJobSettings>;
  pollingIntervalS?: number;
  maintenanceIntervalS?: number;
  /** Compute on worker threads (default) or, with `false`, on this thread's event loop. */
  threads?: boolean;
  /** Mails failed-audit notices to the project's watchers; none are sent without it. */
  mail?: { mailer: Mailer; publicUrl: string };
}): Promise<Processing> {
  const boss = await startJobBoss(options.databaseUrl, {
    ...(options.logger === undefined ? {} : { logger: options.logger }),
    ...(options.maintenanceIntervalS === undefined ? {} : { maintenanceIntervalS: options.maintenanceIntervalS }),
  });
  const runs = createKnexProcessingRunStore(options.db);
  const projects = createKnexProjectStore(options.db);
  const mail = options.mail;
  // Read, split, audit and summarise run on a worker thread, so API requests are served meanwhile.
  const compute = options.worker === false || options.threads === false ? undefined : createThreadCompute();
  const worker =
    options.worker === false
      ? undefined
      : await startProcessingWorker(
          boss,
          {
            projects,
            logs: createKnexLogStore(options.db),
            runs,
            dives: createKnexDiveStore(options.db),
            compute,
          },
          {
            ...(options.logger === undefined ? {} : { logger: options.logger }),
            ...(options.hooks === undefined ? {} : { hooks: options.hooks }),
            ...(options.settings === undefined ? {} : { settings: options.settings }),
            ...(options.pollingIntervalS === undefined ? {} : { pollingIntervalS: options.pollingIntervalS }),
            // The threads load the code (seconds on a busy machine) while the server starts answering.
            ...(compute === undefined ? {} : { takeJobsAfter: compute.ready() }),
            ...(mail === undefined
              ? {}
              : { notify: (audit: FailedAudit) => notifyFailedAudit({ projects, ...mail }, audit) }),
          },
        );
  const queue = createProcessingQueue(boss, runs, options.settings, worker?.wake);
  return {
    queue,
    worker,
    ready: async () => {
      await worker?.ready();
    },
    stop: async () => {
      await worker?.stop();
      await boss.stop({ graceful: true, wait: true, timeout: 5000 });
      await compute?.close();
    },
  };
}
