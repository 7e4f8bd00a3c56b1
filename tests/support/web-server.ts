import { existsSync } from 'node:fs';
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { fileURLToPath } from 'node:url';
import { createApp, createPgSessionStore, createSmtpMailer, startFakeSmtpServer } from '@leadline/server';
import type { Knex } from 'knex';
import pino from 'pino';

/** The built web site that `npm test` builds before the suites run. */
export const WEB_DIST = fileURLToPath(new URL('../../packages/web/dist', import.meta.url));

/** Serves the API and the built site on a free loopback port. */
export async function startWebServer(database: {
  db: Knex;
  url: string;
}): Promise<{ baseUrl: string; close: () => Promise<void> }> {
  const { db, url } = database;
  if (!existsSync(`${WEB_DIST}/index.html`))
    throw new Error(`no built web site in ${WEB_DIST}: npm test builds it first`);
  // Sessions in the same database as `db`; mail to a fake SMTP server of its own.
  const sessions = createPgSessionStore(url, { pruneIntervalS: false });
  const mailbox = await startFakeSmtpServer();
  const mailer = createSmtpMailer(mailbox.url, 'Leadline test <leadline@test.invalid>');
  const app = createApp({
    db,
    sessionStore: sessions.store,
    sessionSecret: 'browser-test-session-secret-32-chars-long',
    mailer,
    fakeMailbox: mailbox,
    publicUrl: 'http://127.0.0.1',
    logger: pino({ level: 'silent' }),
    webDist: WEB_DIST,
  });
  const server: Server = await new Promise((resolve) => {
    const listening = app.listen(0, '127.0.0.1', () => resolve(listening));
  });
  const { port } = server.address() as AddressInfo;
  return {
    baseUrl: `http://127.0.0.1:${port}`,
    close: async () => {
      await new Promise<void>((resolve) => {
        server.closeAllConnections();
        server.close(() => resolve());
      });
      mailer.close();
      await sessions.close();
      await mailbox.close();
    },
  };
}
