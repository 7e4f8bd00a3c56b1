import { execFileSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { LEADLINE_VERSION } from '@leadline/core';
import { describe, expect, it } from 'vitest';
import { EXIT_OK, EXIT_USAGE } from './exit-codes.js';
import type { CliIo } from './io.js';
import { main } from './main.js';

function captureIo(): CliIo & { out: string[]; err: string[] } {
  const out: string[] = [];
  const err: string[] = [];
  return { out, err, isTty: false, stdout: (t) => out.push(t), stderr: (t) => err.push(t) };
}

describe('main', () => {
  it('prints the version with --version', async () => {
    const io = captureIo();
    expect(await main(['--version'], io)).toBe(EXIT_OK);
    expect(io.out.join('').trim()).toBe(LEADLINE_VERSION);
  });

  it('prints help naming the job, the exit codes and the safety caution', async () => {
    const io = captureIo();
    expect(await main(['--help'], io)).toBe(EXIT_OK);
    const help = io.out.join('');
    expect(help).toContain('Usage: leadline');
    expect(help).toContain('USBL position logs');
    expect(help).toContain('Exit codes:');
    expect(help).toContain('not a navigation aid');
  });

  it('refuses an unknown option with the usage exit code and a hint', async () => {
    const io = captureIo();
    expect(await main(['--frobnicate'], io)).toBe(EXIT_USAGE);
    expect(io.err.join('')).toMatch(/unknown option '--frobnicate'/);
  });

  it('runs as the installed `leadline` binary through npx from the repository root', () => {
    const root = fileURLToPath(new URL('../../..', import.meta.url));
    const stdout = execFileSync('npx', ['--no-install', 'leadline', '--version'], { cwd: root, encoding: 'utf8' });
    expect(stdout.trim()).toBe(LEADLINE_VERSION);
  });
});
