// @ts-check
// `npm start`: install what is missing, start PostgreSQL on loopback (unless DATABASE_URL is set),
// migrate, load the demo data into an empty database, build the web site and serve API and web.
import { spawn } from 'node:child_process';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { runMain, SetupError, say } from './lib/console.mjs';
import { ensureNodeModules } from './lib/dependencies.mjs';
import {
  databaseUrl,
  ensureDatabase,
  ensurePostgres,
  isPortFree,
  ownerCanUse,
  portForCheckout,
  startCluster,
} from './lib/postgres.mjs';
import { run } from './lib/processes.mjs';

const root = fileURLToPath(new URL('..', import.meta.url));
const DEFAULT_HTTP_PORT = 8480;

await runMain(async () => {
  const httpPort = Number(process.env.PORT ?? DEFAULT_HTTP_PORT);
  if (!Number.isInteger(httpPort) || httpPort < 1 || httpPort > 65535)
    throw new SetupError(`PORT must be a port number, not "${process.env.PORT}".`);
  if (!(await isPortFree(httpPort)))
    throw new SetupError(`port ${httpPort} is taken; stop what uses it or choose another with PORT=<port> npm start.`);

  await ensureNodeModules(root);

  /** @type {() => Promise<void>} */
  let stopDatabase = async () => {};
  let url = process.env.DATABASE_URL;
  if (url) {
    say('using the database in DATABASE_URL; starting none');
  } else {
    const bin = await ensurePostgres();
    const preferred = join(root, '.data', 'pg');
    const dataDir = ownerCanUse(preferred) ? preferred : join('/var/tmp', `leadline-${portForCheckout(root, 0)}`, 'pg');
    if (dataDir !== preferred) say(`the postgres user cannot reach ${preferred}; keeping the database in ${dataDir}`);
    const cluster = await startCluster({ bin, dataDir, port: portForCheckout(root, 54000), throwaway: false });
    stopDatabase = cluster.stop;
    await ensureDatabase({ bin, port: cluster.port, name: 'leadline' });
    url = databaseUrl(cluster.port, 'leadline');
    say(`PostgreSQL on 127.0.0.1:${cluster.port}, data in ${dataDir}`);
  }
  const env = { ...process.env, DATABASE_URL: url };

  try {
    const migrate = await run(process.execPath, ['--import', 'tsx', 'scripts/migrate.ts', '--demo'], {
      cwd: root,
      env,
    });
    if (migrate.code !== 0) throw new SetupError('migrations or demo data failed (see the line above).');

    say('building the web site ...');
    const build = await run(process.execPath, ['node_modules/vite/bin/vite.js', 'build', '--logLevel', 'warn'], {
      cwd: root,
      quiet: true,
    });
    if (build.code !== 0)
      throw new SetupError(`the web build failed: ${build.output.trim().split('\n').slice(-3).join(' | ')}`);
  } catch (error) {
    await stopDatabase();
    throw error;
  }

  const server = spawn(process.execPath, ['--import', 'tsx', 'packages/server/src/main.ts'], {
    cwd: root,
    env: { ...env, PORT: String(httpPort), HOST: '127.0.0.1', WEB_DIST: join(root, 'packages', 'web', 'dist') },
    stdio: 'inherit',
  });
  const forward = (/** @type {NodeJS.Signals} */ signal) => server.kill(signal);
  process.on('SIGINT', forward);
  process.on('SIGTERM', forward);

  void waitForHealth(httpPort, server).then((healthy) => {
    if (!healthy) return;
    say(`Leadline is running at http://127.0.0.1:${httpPort}/  (Ctrl-C stops server and database)`);
    say('demo sign-in: maren@hollowtide.example / leadline-demo (admin); tomas@… editor, ilse@… viewer');
  });

  const code = await new Promise((resolve) => server.on('exit', (exitCode) => resolve(exitCode ?? 0)));
  say('stopping ...');
  await stopDatabase();
  process.exitCode = Number(code);
});

/** @param {number} port @param {import('node:child_process').ChildProcess} server */
async function waitForHealth(port, server) {
  for (let attempt = 0; attempt < 100 && server.exitCode === null; attempt++) {
    try {
      const response = await fetch(`http://127.0.0.1:${port}/api/v1/health`);
      if (response.ok) return true;
    } catch {
      // not listening yet
    }
    await new Promise((resolve) => setTimeout(resolve, 200));
  }
  return false;
}
