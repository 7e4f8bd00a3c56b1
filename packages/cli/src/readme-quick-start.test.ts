import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';

const ROOT = fileURLToPath(new URL('../../../', import.meta.url));

/** The first shell block under the README's "Command line quick start" heading. */
function quickStartBlock(): string {
  const readme = readFileSync(join(ROOT, 'README.md'), 'utf8');
  const section = readme.slice(readme.indexOf('## Command line quick start'));
  const match = /```sh\n([\s\S]*?)```/.exec(section);
  if (!match?.[1]) throw new Error('README.md has no shell block under "Command line quick start"');
  return match[1];
}

const scratch = mkdtempSync(join(tmpdir(), 'leadline-readme-'));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

describe('README command line quick start', () => {
  it('runs as written from the repository root, every command exiting 0, and leaves its outputs in the scratch folder', () => {
    // `cd "$(mktemp -d)"` in the block makes its folder under TMPDIR, which this test owns.
    const run = spawnSync('bash', ['-euo', 'pipefail', '-c', quickStartBlock()], {
      cwd: ROOT,
      env: { ...process.env, TMPDIR: scratch },
      encoding: 'utf8',
      timeout: 300_000,
    });
    expect(run.stderr).not.toMatch(/not read|error/i);
    expect(run.status).toBe(0);
    const [session] = readdirSync(scratch);
    expect(session).toBeDefined();
    const folder = join(scratch, session as string);
    expect(existsSync(join(folder, 'qc', 'audit-report.html'))).toBe(true);
    const converted = readdirSync(join(folder, 'client', 'greywhistle'));
    expect(converted.filter((f) => f.endsWith('.csv'))).toHaveLength(6);
    expect(readdirSync(join(folder, 'resolved', 'greywhistle')).some((f) => f.endsWith('.gpx'))).toBe(true);
    // The client's CRS is in the converted files' header (GDA2020 / MGA zone 55 in metres).
    const first = converted.find((f) => f.endsWith('_vehicle.csv')) as string;
    expect(readFileSync(join(folder, 'client', 'greywhistle', first), 'utf8').split('\r\n')[0]).toContain(
      'easting_m,northing_m',
    );
  }, 320_000);
});
