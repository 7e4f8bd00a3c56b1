import type { Server } from 'node:http';
import { LEADLINE_VERSION } from '@leadline/core';
import { createApp } from './app.js';
import { ConfigError, parseConfig } from './config.js';
import { createDatabase } from './db.js';
import { createKnexHealthStore } from './stores/health-store.js';

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

const db = createDatabase(config.databaseUrl);
const app = createApp({ healthStore: createKnexHealthStore(db), webDist: config.webDist });

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
    void db.destroy().finally(() => process.exit(0));
  });
  server.closeAllConnections();
  setTimeout(() => process.exit(0), 5000).unref();
}
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
