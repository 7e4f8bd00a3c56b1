import { existsSync } from 'node:fs';
import { createServer } from 'node:http';
import type { AddressInfo } from 'node:net';
import { fileURLToPath } from 'node:url';
import {
  createApp,
  createPgSessionStore,
  createSmtpMailer,
  startFakeSmtpServer,
  startProcessing,
} from '@leadline/server';
import type { Knex } from 'knex';
import pino from 'pino';

/** The built web site that `npm test` builds before the suites run. */
export const WEB_DIST = fileURLToPath(new URL('../../packages/web/dist', import.meta.url));

/**
 * Serves the API and the built site on a free loopback port; with `processing`, a job queue and a
 * worker on the same database process uploads as `npm start` does.
 */
export async function startWebServer(
  database: { db: Knex; url: string },
  options: { processing?: boolean; tileUrl?: string; tileAttribution?: string } = {},
): Promise<{ baseUrl: string; close: () => Promise<void> }> {
  const { db, url } = database;
  if (!existsSync(`${WEB_DIST}/index.html`))
    throw new Error(`no built web site in ${WEB_DIST}: npm test builds it first`);
  // Sessions in the same database as `db`; mail to a fake SMTP server of its own.
  const sessions = createPgSessionStore(url, { pruneIntervalS: false });
  const mailbox = await startFakeSmtpServer();
  const mailer = createSmtpMailer(mailbox.url, 'Leadline test <leadline@test.invalid>');
  const processing = options.processing
    ? await startProcessing({ databaseUrl: url, db, logger: pino({ level: 'silent' }), pollingIntervalS: 0.5 })
    : undefined;
  // Listen first, so links in e-mails (PUBLIC_URL) point at this very server and its port.
  const server = createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as AddressInfo;
  const baseUrl = `http://127.0.0.1:${port}`;
  const app = createApp({
    db,
    sessionStore: sessions.store,
    sessionSecret: 'browser-test-session-secret-32-chars-long',
    mailer,
    fakeMailbox: mailbox,
    publicUrl: baseUrl,
    logger: pino({ level: 'silent' }),
    webDist: WEB_DIST,
    tileUrl: options.tileUrl,
    tileAttribution: options.tileAttribution,
    ...(processing === undefined ? {} : { processingQueue: processing.queue }),
  });
  server.on('request', app);
  return {
    baseUrl,
    close: async () => {
      await new Promise<void>((resolve) => {
        server.closeAllConnections();
        server.close(() => resolve());
      });
      await processing?.stop();
      mailer.close();
      await sessions.close();
      await mailbox.close();
    },
  };
}
