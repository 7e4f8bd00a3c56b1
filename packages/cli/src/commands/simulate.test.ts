import { mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, relative } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { EXIT_IO, EXIT_OK, EXIT_USAGE } from '../exit-codes.js';
import type { CliIo } from '../io.js';
import { main } from '../main.js';
import { MANIFEST_FILE } from '../support/index.js';

function captureIo(): CliIo & { out: string[]; err: string[] } {
  const out: string[] = [];
  const err: string[] = [];
  return { out, err, isTty: false, stdout: (t) => out.push(t), stderr: (t) => err.push(t) };
}

function listFiles(root: string): string[] {
  return readdirSync(root, { recursive: true, withFileTypes: true })
    .filter((entry) => entry.isFile())
    .map((entry) => relative(root, join(entry.parentPath, entry.name)))
    .sort();
}

const scratch = mkdtempSync(join(tmpdir(), 'leadline-simulate-'));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

describe('runSimulate', () => {
  const args = ['simulate', '--dives', '3', '--seed', '42', '--dive-minutes', '5', '--jobs', '1'];

  it('writes each dive’s logs and truth file plus a manifest, and reports them as JSON', async () => {
    const out = join(scratch, 'a');
    const io = captureIo();
    expect(await main([...args, '--out', out, '--json'], io)).toBe(EXIT_OK);
    const report = JSON.parse(io.out.join(''));
    expect(report.dives).toBe(3);
    expect(report.vehicleFixes).toBeGreaterThan(3 * 200);
    const files = listFiles(out);
    expect(files).toEqual([...report.files, MANIFEST_FILE].sort());
    expect(files.filter((f) => f.endsWith('.truth.json'))).toHaveLength(3);
    const manifest = JSON.parse(readFileSync(join(out, MANIFEST_FILE), 'utf8'));
    expect(manifest.verb).toBe('simulate');
    expect(manifest.settings).toMatchObject({ seed: 42, dives: 3, diveMinutes: 5 });
    expect(manifest.outputs.map((o: { path: string }) => o.path).sort()).toEqual(report.files);
  });

  it('writes the same bytes for the same seed, on worker threads too', async () => {
    const first = join(scratch, 'a');
    const second = join(scratch, 'b');
    expect(await main([...args.slice(0, -2), '--jobs', '2', '--out', second, '--quiet'], captureIo())).toBe(EXIT_OK);
    const files = listFiles(first).filter((f) => f !== MANIFEST_FILE);
    expect(listFiles(second).filter((f) => f !== MANIFEST_FILE)).toEqual(files);
    for (const file of files)
      expect(readFileSync(join(second, file)).equals(readFileSync(join(first, file)))).toBe(true);
  });

  it('refuses to overwrite earlier outputs without --force, and overwrites with it', async () => {
    const out = join(scratch, 'a');
    const io = captureIo();
    expect(await main([...args, '--out', out], io)).toBe(EXIT_IO);
    expect(io.err.join('')).toMatch(/already exists; add --force/);
    expect(await main([...args, '--out', out, '--force', '--quiet'], captureIo())).toBe(EXIT_OK);
  });

  it('writes every dive in one layout with --layout', async () => {
    const out = join(scratch, 'gpx');
    expect(await main([...args, '--layout', 'gpx', '--out', out, '--quiet'], captureIo())).toBe(EXIT_OK);
    const logs = listFiles(out).filter((f) => f !== MANIFEST_FILE && !f.endsWith('.truth.json'));
    expect(logs).toHaveLength(3);
    for (const log of logs) expect(log.endsWith('.gpx')).toBe(true);
  });

  it('answers a bad count with the usage exit code and says what is valid', async () => {
    const io = captureIo();
    expect(await main(['simulate', '--dives', '0', '--out', join(scratch, 'c')], io)).toBe(EXIT_USAGE);
    expect(io.err.join('')).toMatch(/positive whole number/);
  });
});
