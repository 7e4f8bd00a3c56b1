// `npm run worker`: a processing worker on its own, sharing the server's database (DATABASE_URL),
// so more machines can work the same queue.
import { createDatabase } from './db.js';
import { createLogger } from './http/request-logger.js';
import { startProcessing } from './jobs/start-processing.js';

const databaseUrl = process.env.DATABASE_URL;
if (databaseUrl === undefined || !/^postgres(ql)?:\/\//.test(databaseUrl)) {
  process.stderr.write("leadline worker: DATABASE_URL must be set to the server's postgres:// database URL.\n");
  process.exit(1);
}
const logger = createLogger(process.env.LOG_LEVEL ?? 'info');
const db = createDatabase(databaseUrl);
const processing = await startProcessing({ databaseUrl, db, logger });
process.stdout.write('leadline worker: processing logs from the job queue (Ctrl-C stops)\n');

let stopping = false;
function stop(): void {
  if (stopping) return;
  stopping = true;
  void processing
    .stop()
    .then(() => db.destroy())
    .finally(() => process.exit(0));
  setTimeout(() => process.exit(0), 10_000).unref();
}
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
