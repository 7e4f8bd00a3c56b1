// @ts-check
import { createHash } from 'node:crypto';
import { chownSync, existsSync, mkdirSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { join } from 'node:path';
import { SetupError, say } from './console.mjs';
import { ensureDebianPackages } from './dependencies.mjs';
import { isRoot, run, runQuick } from './processes.mjs';

const POSTGRES_ROOT = '/usr/lib/postgresql';
const DATABASE_USER = 'app';

/** The newest installed PostgreSQL server's bin folder, installing PostgreSQL when it is missing. */
export async function ensurePostgres() {
  let bin = findPostgresBin();
  if (bin === undefined) {
    await ensureDebianPackages([{ pkg: 'postgresql', provides: `${POSTGRES_ROOT}/15/bin/postgres` }], 'the database');
    bin = findPostgresBin();
  }
  if (bin === undefined)
    throw new SetupError(`PostgreSQL is installed but no server binary was found under ${POSTGRES_ROOT}/*/bin.`);
  return bin;
}

function findPostgresBin() {
  if (!existsSync(POSTGRES_ROOT)) return undefined;
  const versions = readdirSync(POSTGRES_ROOT)
    .filter(
      (name) =>
        existsSync(join(POSTGRES_ROOT, name, 'bin', 'postgres')) &&
        existsSync(join(POSTGRES_ROOT, name, 'bin', 'initdb')),
    )
    .sort((a, b) => Number(b) - Number(a));
  return versions[0] === undefined ? undefined : join(POSTGRES_ROOT, versions[0], 'bin');
}

/** A port derived from the checkout's path, so two clones on one machine do not collide. @param {string} root @param {number} base */
export function portForCheckout(root, base) {
  const digest = createHash('sha256').update(root).digest();
  return base + (digest.readUInt16BE(0) % 500);
}

/** Whether a TCP port on 127.0.0.1 is free. @param {number} port */
export function isPortFree(port) {
  return new Promise((resolve) => {
    const server = createServer();
    server.once('error', () => resolve(false));
    server.listen(port, '127.0.0.1', () => server.close(() => resolve(true)));
  });
}

/** A free port chosen by the system. @returns {Promise<number>} */
export function findFreePort() {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const address = server.address();
      const port = typeof address === 'object' && address !== null ? address.port : 0;
      server.close(() => resolve(port));
    });
  });
}

/**
 * Commands run as the `postgres` user when we are root (initdb and postgres refuse root), as
 * ourselves otherwise.
 * @param {string} command @param {string[]} args
 */
function asDatabaseOwner(command, args) {
  return isRoot() ? { command: 'runuser', args: ['-u', 'postgres', '--', command, ...args] } : { command, args };
}

/** Whether the database owner can write into `dir` (every parent folder must be traversable). @param {string} dir */
export function ownerCanUse(dir) {
  if (!isRoot()) return true;
  mkdirSync(dir, { recursive: true });
  giveToPostgres(dir);
  return runQuick('runuser', ['-u', 'postgres', '--', 'test', '-w', dir]).code === 0;
}

/** @param {string} dir */
function giveToPostgres(dir) {
  if (!isRoot()) return;
  const ids = runQuick('id', ['-u', 'postgres']);
  const gids = runQuick('id', ['-g', 'postgres']);
  if (ids.code !== 0) throw new SetupError('the postgres system user is missing; reinstall the postgresql package.');
  chownSync(dir, Number(ids.stdout.trim()), Number(gids.stdout.trim()));
}

/**
 * A PostgreSQL cluster on 127.0.0.1 with its data in `dataDir`: created on first use, started
 * unless already running. Resolves with its URL pieces and a `stop` that stops it only if this
 * call started it.
 * @param {{ bin: string, dataDir: string, port: number, throwaway: boolean }} options
 */
export async function startCluster({ bin, dataDir, port, throwaway }) {
  mkdirSync(dataDir, { recursive: true });
  giveToPostgres(dataDir);
  const logFile = join(dataDir, 'server.log');
  if (!existsSync(join(dataDir, 'PG_VERSION'))) {
    const init = asDatabaseOwner(join(bin, 'initdb'), [
      '-D',
      dataDir,
      '-U',
      DATABASE_USER,
      '--auth=trust',
      '-E',
      'UTF8',
      '--locale=C.UTF-8',
      ...(throwaway ? ['--no-sync'] : []),
    ]);
    const { code, output } = await run(init.command, init.args, { quiet: true });
    if (code !== 0)
      throw new SetupError(`initdb failed in ${dataDir}: ${output.trim().split('\n').slice(-3).join(' | ')}`);
  }

  const status = asDatabaseOwner(join(bin, 'pg_ctl'), ['-D', dataDir, 'status']);
  const running = runQuick(status.command, status.args).code === 0;
  let runningPort = port;
  if (running) {
    const pid = readFileSync(join(dataDir, 'postmaster.pid'), 'utf8').split('\n');
    runningPort = Number(pid[3]);
    say(`PostgreSQL already running on 127.0.0.1:${runningPort} with data in ${dataDir}; reusing it`);
  } else {
    if (!(await isPortFree(port)))
      throw new SetupError(
        `port ${port} for PostgreSQL is taken; free it or set DATABASE_URL to use a database you run.`,
      );
    const settings = `-c listen_addresses=127.0.0.1 -p ${port} -k ${dataDir}${throwaway ? ' -c fsync=off -c synchronous_commit=off -c full_page_writes=off' : ''}`;
    const start = asDatabaseOwner(join(bin, 'pg_ctl'), [
      '-D',
      dataDir,
      '-l',
      logFile,
      '-w',
      '-t',
      '30',
      '-o',
      settings,
      'start',
    ]);
    const { code } = await run(start.command, start.args, { quiet: true });
    if (code !== 0) {
      const tail = existsSync(logFile)
        ? readFileSync(logFile, 'utf8').trim().split('\n').slice(-3).join(' | ')
        : 'no log written';
      throw new SetupError(`PostgreSQL failed to start on 127.0.0.1:${port} (log ${logFile}): ${tail}`);
    }
  }

  const stop = async () => {
    if (running) return;
    const stopCommand = asDatabaseOwner(join(bin, 'pg_ctl'), ['-D', dataDir, '-m', 'fast', '-w', 'stop']);
    await run(stopCommand.command, stopCommand.args, { quiet: true });
    if (throwaway) rmSync(dataDir, { recursive: true, force: true });
  };
  return { port: runningPort, user: DATABASE_USER, stop };
}

/** Creates `name` in the cluster when it does not exist. @param {{ bin: string, port: number, name: string, template?: string }} options */
export async function ensureDatabase({ bin, port, name, template }) {
  const psql = join(bin, 'psql');
  const base = [
    '-h',
    '127.0.0.1',
    '-p',
    String(port),
    '-U',
    DATABASE_USER,
    '-d',
    'postgres',
    '-v',
    'ON_ERROR_STOP=1',
    '-tA',
  ];
  const exists = runQuick(psql, [...base, '-c', `select 1 from pg_database where datname = '${name}'`]);
  if (exists.code !== 0) throw new SetupError(`cannot reach PostgreSQL on 127.0.0.1:${port}: ${exists.stderr.trim()}`);
  if (exists.stdout.trim() === '1') return;
  const create = runQuick(psql, [
    ...base,
    '-c',
    `create database "${name}"${template ? ` template "${template}"` : ''}`,
  ]);
  if (create.code !== 0) throw new SetupError(`cannot create database ${name}: ${create.stderr.trim()}`);
}

/** @param {number} port @param {string} name */
export function databaseUrl(port, name) {
  return `postgres://${DATABASE_USER}@127.0.0.1:${port}/${name}`;
}
