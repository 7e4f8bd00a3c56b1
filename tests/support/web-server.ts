import { existsSync } from 'node:fs';
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { fileURLToPath } from 'node:url';
import { createApp, createKnexHealthStore } from '@leadline/server';
import type { Knex } from 'knex';

/** The built web site that `npm test` builds before the suites run. */
export const WEB_DIST = fileURLToPath(new URL('../../packages/web/dist', import.meta.url));

/** Serves the API and the built site on a free loopback port. */
export async function startWebServer(db: Knex): Promise<{ baseUrl: string; close: () => Promise<void> }> {
  if (!existsSync(`${WEB_DIST}/index.html`))
    throw new Error(`no built web site in ${WEB_DIST}: npm test builds it first`);
  const app = createApp({ healthStore: createKnexHealthStore(db), webDist: WEB_DIST });
  const server: Server = await new Promise((resolve) => {
    const listening = app.listen(0, '127.0.0.1', () => resolve(listening));
  });
  const { port } = server.address() as AddressInfo;
  return {
    baseUrl: `http://127.0.0.1:${port}`,
    close: () =>
      new Promise((resolve) => {
        server.closeAllConnections();
        server.close(() => resolve());
      }),
  };
}
