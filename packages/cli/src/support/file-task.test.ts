import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { runFileTask } from './file-task.js';
import { sha256Hex } from './output-folder.js';

let dir: string;
beforeEach(() => {
  dir = mkdtempSync(join(tmpdir(), 'leadline-file-task-'));
  writeFileSync(join(dir, 'dive.csv'), 'time,lat,lon\n');
});
afterEach(() => rmSync(dir, { recursive: true, force: true }));

// A verb's work that asks for two files beside the input: a report and a track.
const twoFiles = (payload: { bytes: Uint8Array; label: string }) => ({
  ok: true,
  files: [
    { suffix: '.report', extension: '.json', content: `{"bytes":${payload.bytes.byteLength}}\n` },
    { suffix: '', extension: '.geojson', content: new TextEncoder().encode(`{"label":"${payload.label}"}\n`) },
  ],
});

describe('runFileTask', () => {
  it('reads and hashes the input, writes text and bytes, and sends back only what it wrote', async () => {
    const out = join(dir, 'out');
    const outcome = await runFileTask(twoFiles, {
      source: { path: join(dir, 'dive.csv') },
      target: { rules: { root: out, force: false, inputPaths: [join(dir, 'dive.csv')] }, relativePath: 'a/dive.csv' },
      task: { label: 'HT-001' },
    });
    expect(outcome.input).toEqual({ bytes: 13, sha256: sha256Hex('time,lat,lon\n') });
    expect(outcome.written.map((w) => w.path)).toEqual([join('a', 'dive.report.json'), join('a', 'dive.geojson')]);
    expect(readFileSync(join(out, 'a', 'dive.report.json'), 'utf8')).toBe('{"bytes":13}\n');
    expect(outcome.written[1]?.sha256).toBe(sha256Hex('{"label":"HT-001"}\n'));
    expect(outcome.result.files.map((f) => f.content)).toEqual(['', '']);
    expect(outcome.writeError).toBeUndefined();
  });

  it('keeps the files written before one it may not overwrite, and says why', async () => {
    const out = join(dir, 'out');
    mkdirSync(out);
    writeFileSync(join(out, 'dive.geojson'), 'an earlier run\n');
    const outcome = await runFileTask(twoFiles, {
      source: { bytes: new TextEncoder().encode('x\n') },
      target: { rules: { root: out, force: false, inputPaths: [] }, relativePath: 'dive.csv' },
      task: { label: 'HT-002' },
    });
    expect(outcome.written.map((w) => w.path)).toEqual(['dive.report.json']);
    expect(existsSync(join(out, 'dive.report.json'))).toBe(true);
    expect(readFileSync(join(out, 'dive.geojson'), 'utf8')).toBe('an earlier run\n');
    expect(outcome.writeError).toMatch(/dive\.geojson: already exists; add --force/);
  });
});
