// @ts-check
import { spawn, spawnSync } from 'node:child_process';
import { SetupError } from './console.mjs';

/**
 * Runs a command to the end, streaming its output, and resolves with its exit code.
 * @param {string} command @param {string[]} args
 * @param {{ cwd?: string, env?: NodeJS.ProcessEnv, quiet?: boolean }} [options]
 * @returns {Promise<{ code: number, output: string }>}
 */
export function run(command, args, options = {}) {
  return new Promise((resolve, reject) => {
    const child = spawn(command, args, {
      cwd: options.cwd,
      env: options.env ?? process.env,
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    let output = '';
    const keep = (/** @type {Buffer} */ chunk, /** @type {NodeJS.WriteStream} */ stream) => {
      output += chunk.toString();
      if (output.length > 200_000) output = output.slice(-100_000);
      if (!options.quiet) stream.write(chunk);
    };
    child.stdout.on('data', (chunk) => keep(chunk, process.stdout));
    child.stderr.on('data', (chunk) => keep(chunk, process.stderr));
    child.on('error', (error) => reject(new SetupError(`cannot run ${command}: ${error.message}`)));
    child.on('close', (code, signal) => resolve({ code: code ?? (signal ? 128 : 1), output }));
  });
}

/** Runs a short command synchronously and returns its status and output. @param {string} command @param {string[]} args @param {import('node:child_process').SpawnSyncOptions} [options] */
export function runQuick(command, args, options = {}) {
  const result = spawnSync(command, args, { encoding: 'utf8', ...options });
  return {
    code: result.status ?? 1,
    stdout: String(result.stdout ?? ''),
    stderr: String(result.stderr ?? ''),
    error: result.error,
  };
}

/** Whether an executable is on PATH or at an absolute path. @param {string} command */
export function hasCommand(command) {
  if (command.startsWith('/')) return runQuick('test', ['-x', command]).code === 0;
  return runQuick('sh', ['-c', `command -v ${command}`]).code === 0;
}

/** Whether this process runs as root. */
export function isRoot() {
  return typeof process.getuid === 'function' && process.getuid() === 0;
}
