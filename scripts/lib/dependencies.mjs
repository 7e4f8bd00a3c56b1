// @ts-check
import { existsSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { SetupError, say } from './console.mjs';
import { hasCommand, isRoot, run } from './processes.mjs';

/** Installs the npm dependencies when node_modules is missing or older than the lock file. @param {string} root */
export async function ensureNodeModules(root) {
  const marker = join(root, 'node_modules', '.package-lock.json');
  const lock = join(root, 'package-lock.json');
  if (existsSync(marker) && statSync(marker).mtimeMs >= statSync(lock).mtimeMs) return;
  say('installing npm dependencies (npm ci) ...');
  const { code, output } = await run('npm', ['ci', '--no-audit', '--no-fund'], { cwd: root, quiet: true });
  if (code !== 0) {
    const tail = output.trim().split('\n').slice(-5).join(' | ');
    throw new SetupError(`npm ci failed (exit ${code}): ${tail}`);
  }
}

let aptUpdated = false;

/**
 * Makes sure Debian packages are installed, judged by a file each one provides. As root, installs the
 * missing ones with apt-get; otherwise throws one line naming what to install.
 * @param {Array<{ pkg: string, provides: string }>} wanted @param {string} why
 */
export async function ensureDebianPackages(wanted, why) {
  const missing = wanted.filter(({ provides }) => !existsSync(provides));
  if (missing.length === 0) return;
  const names = missing.map(({ pkg }) => pkg);
  if (!isRoot()) {
    throw new SetupError(`${why} needs ${names.join(', ')}; install with: sudo apt-get install -y ${names.join(' ')}`);
  }
  if (!hasCommand('apt-get')) {
    throw new SetupError(
      `${why} needs ${names.join(', ')}, and apt-get is not available here; install them with this system's package manager.`,
    );
  }
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  if (!aptUpdated) {
    say('updating the Debian package lists (apt-get update) ...');
    const update = await run('apt-get', ['update', '-qq'], { env, quiet: true });
    if (update.code !== 0)
      throw new SetupError(`apt-get update failed: ${lastLine(update.output)}; install ${names.join(' ')} by hand.`);
    aptUpdated = true;
  }
  say(`installing ${names.join(', ')} for ${why} (apt-get install) ...`);
  const install = await run('apt-get', ['install', '-y', '-qq', ...names], { env, quiet: true });
  if (install.code !== 0)
    throw new SetupError(`apt-get install ${names.join(' ')} failed: ${lastLine(install.output)}`);
  const stillMissing = missing.filter(({ provides }) => !existsSync(provides));
  if (stillMissing.length > 0)
    throw new SetupError(
      `apt-get installed ${names.join(' ')} but ${stillMissing.map((m) => m.provides).join(', ')} is still missing.`,
    );
}

/** @param {string} output */
function lastLine(output) {
  return output.trim().split('\n').at(-1) ?? '(no output)';
}
