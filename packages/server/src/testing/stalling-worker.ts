// A processing worker for the crash test: it does the work of a run, prints "stalled <runId>" and
// then waits forever before storing anything, so the test can kill it mid-job (SIGKILL).
import pino from 'pino';
import { createDatabase } from '../db.js';
import { startProcessing } from '../jobs/start-processing.js';

const databaseUrl = process.env.DATABASE_URL;
if (databaseUrl === undefined) throw new Error('DATABASE_URL is not set');
const db = createDatabase(databaseUrl);
const processing = await startProcessing({
  databaseUrl,
  db,
  logger: pino({ level: 'silent' }),
  pollingIntervalS: 0.5,
  hooks: {
    beforeStore: (run) => {
      process.stdout.write(`stalled ${run.id}\n`);
      return new Promise<void>(() => {});
    },
  },
});
// Jobs are taken once the worker threads have loaded: the test's 1 s expiry then times the work alone.
await processing.ready();
process.stdout.write('ready\n');
