// `npm run worker`: a processing worker on its own, sharing the server's database (DATABASE_URL),
// so more machines can work the same queue.
import { createDatabase } from './db.js';
import { createLogger } from './http/request-logger.js';
import { startProcessing } from './jobs/start-processing.js';
import { createSmtpMailer } from './mail/mailer.js';

const databaseUrl = process.env.DATABASE_URL;
if (databaseUrl === undefined || !/^postgres(ql)?:\/\//.test(databaseUrl)) {
  process.stderr.write("leadline worker: DATABASE_URL must be set to the server's postgres:// database URL.\n");
  process.exit(1);
}
const logger = createLogger(process.env.LOG_LEVEL ?? 'info');
const db = createDatabase(databaseUrl);
// Failed-audit notices go out when the worker has an SMTP server (SMTP_URL) and the site's address (PUBLIC_URL).
const smtpUrl = process.env.SMTP_URL;
const publicUrl = process.env.PUBLIC_URL;
const mailer =
  smtpUrl === undefined
    ? undefined
    : createSmtpMailer(smtpUrl, process.env.MAIL_FROM ?? 'Leadline <leadline@localhost>');
if (mailer === undefined || publicUrl === undefined)
  process.stdout.write('leadline worker: no SMTP_URL and PUBLIC_URL; failed-audit notices are not mailed\n');
const processing = await startProcessing({
  databaseUrl,
  db,
  logger,
  ...(mailer === undefined || publicUrl === undefined ? {} : { mail: { mailer, publicUrl } }),
});
process.stdout.write('leadline worker: processing logs from the job queue (Ctrl-C stops)\n');

let stopping = false;
function stop(): void {
  if (stopping) return;
  stopping = true;
  void processing
    .stop()
    .then(() => {
      mailer?.close();
      return db.destroy();
    })
    .finally(() => process.exit(0));
  setTimeout(() => process.exit(0), 10_000).unref();
}
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
