import type { Server } from 'node:http';
import { LEADLINE_VERSION } from '@leadline/core';
import { createApp } from './app.js';
import { ConfigError, parseConfig } from './config.js';
import { createDatabase } from './db.js';
import { createLogger } from './http/request-logger.js';
import { createPgSessionStore } from './http/session-store.js';
import { startProcessing } from './jobs/start-processing.js';
import { type FakeSmtpServer, startFakeSmtpServer } from './mail/fake-smtp-server.js';
import { createSmtpMailer } from './mail/mailer.js';

function fail(message: string): never {
  process.stderr.write(`leadline server: ${message}\n`);
  process.exit(1);
}

let config: ReturnType<typeof parseConfig>;
try {
  config = parseConfig(process.env);
} catch (error) {
  if (error instanceof ConfigError) fail(error.message);
  throw error;
}

const logger = createLogger(config.logLevel);
const db = createDatabase(config.databaseUrl);
const sessions = createPgSessionStore(config.databaseUrl, {
  onError: (error) => logger.warn({ err: error }, 'session store: an idle database connection failed'),
});

// Without SMTP_URL (development), mail goes to a local fake SMTP server whose mailbox admins can read.
let fakeMailbox: FakeSmtpServer | undefined;
let smtpUrl = config.smtpUrl;
if (smtpUrl === undefined) {
  fakeMailbox = await startFakeSmtpServer(Number(process.env.FAKE_SMTP_PORT ?? 0));
  smtpUrl = fakeMailbox.url;
  process.stdout.write(
    `leadline server: no SMTP_URL; e-mail goes to the fake SMTP server at ${smtpUrl} (GET /api/v1/dev/mailbox as an admin)\n`,
  );
}
const mailer = createSmtpMailer(smtpUrl, config.mailFrom);

// Processing jobs (pg-boss in the same database) with a worker inside the server; WORKER=off leaves
// the work to standalone workers (`npm run worker`).
const processing = await startProcessing({
  databaseUrl: config.databaseUrl,
  db,
  logger,
  worker: process.env.WORKER !== 'off',
  mail: { mailer, publicUrl: config.publicUrl },
});

const app = createApp({
  processingQueue: processing.queue,
  db,
  sessionStore: sessions.store,
  sessionSecret: config.sessionSecret,
  cookieSecure: config.cookieSecure,
  mailer,
  fakeMailbox,
  publicUrl: config.publicUrl,
  uploadLimitBytes: config.uploadLimitBytes,
  logger,
  webDist: config.webDist,
  tileUrl: config.tileUrl,
  tileAttribution: config.tileAttribution,
});

const server: Server = app.listen(config.port, config.host);
server.on('listening', () => {
  const address = server.address();
  const port = typeof address === 'object' && address !== null ? address.port : config.port;
  process.stdout.write(`leadline server ${LEADLINE_VERSION} listening on http://${config.host}:${port}\n`);
});
server.on('error', (error: NodeJS.ErrnoException) => {
  if (error.code === 'EADDRINUSE')
    fail(`port ${config.port} on ${config.host} is taken; stop what uses it or set PORT to a free port.`);
  if (error.code === 'EACCES')
    fail(`not allowed to listen on port ${config.port}; choose a port above 1024 with PORT.`);
  fail(`cannot listen on ${config.host}:${config.port}: ${error.message}`);
});

let stopping = false;
function stop(): void {
  if (stopping) return;
  stopping = true;
  server.close(() => {
    mailer.close();
    void processing
      .stop()
      .catch(() => undefined)
      .then(() => Promise.allSettled([sessions.close(), fakeMailbox?.close(), db.destroy()]))
      .finally(() => process.exit(0));
  });
  server.closeAllConnections();
  setTimeout(() => process.exit(0), 5000).unref();
}
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
