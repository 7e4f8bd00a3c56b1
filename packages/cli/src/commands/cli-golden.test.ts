import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, relative } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import type { CliIo } from '../io.js';
import { main } from '../main.js';
import { MANIFEST_FILE, sha256Hex } from '../support/output-folder.js';

const CASES = fileURLToPath(new URL('../../../../fixtures/cli/in', import.meta.url));
const GOLDEN = fileURLToPath(new URL('../../../../fixtures/cli/out', import.meta.url));
const INPUTS = fileURLToPath(new URL('../../../../fixtures/read/in', import.meta.url));
const UPDATE = process.env.UPDATE_GOLDEN === '1';
// Files larger than this are pinned by size, SHA-256 and their first lines rather than in full.
const FULL_TEXT_LIMIT = 64 * 1024;

interface RunRecord {
  exitCode: number;
  stdout: string;
  stderr: string;
  files: Record<string, unknown>;
}

async function runCase(args: string[]): Promise<RunRecord> {
  const out = mkdtempSync(join(tmpdir(), 'leadline-cli-golden-'));
  const previous = process.cwd();
  const stdout: string[] = [];
  const stderr: string[] = [];
  const io: CliIo = { isTty: false, stdout: (t) => stdout.push(t), stderr: (t) => stderr.push(t) };
  try {
    process.chdir(INPUTS);
    const exitCode = await main(
      args.map((arg) => arg.replaceAll('<out>', out)),
      io,
    );
    const scrub = (text: string) => text.replaceAll(out, '<out>');
    return { exitCode, stdout: scrub(stdout.join('')), stderr: scrub(stderr.join('')), files: readOutputs(out, scrub) };
  } finally {
    process.chdir(previous);
    rmSync(out, { recursive: true, force: true });
  }
}

function readOutputs(root: string, scrub: (text: string) => string): Record<string, unknown> {
  const files: Record<string, unknown> = {};
  const walk = (dir: string) => {
    for (const name of readdirSync(dir).sort()) {
      const path = join(dir, name);
      if (statSync(path).isDirectory()) {
        walk(path);
        continue;
      }
      const key = relative(root, path);
      const bytes = readFileSync(path);
      if (name === MANIFEST_FILE) {
        const { startedAt: _s, finishedAt: _f, ...manifest } = JSON.parse(scrub(bytes.toString('utf8')));
        files[key] = manifest;
      } else if (bytes.length <= FULL_TEXT_LIMIT) {
        files[key] = scrub(bytes.toString('utf8'));
      } else {
        files[key] = {
          bytes: bytes.length,
          sha256: sha256Hex(bytes),
          head: bytes.toString('utf8', 0, 400).split('\n').slice(0, 4),
        };
      }
    }
  };
  if (existsSync(root)) walk(root);
  return files;
}

const cases = readdirSync(CASES)
  .filter((name) => name.endsWith('.json'))
  .sort();

describe('leadline golden runs (fixtures/cli)', () => {
  it('has cases to run', () => {
    expect(cases.length).toBeGreaterThan(0);
  });

  for (const file of cases) {
    const name = file.replace(/\.json$/, '');
    it(`${name} gives the golden exit code, output and files`, async () => {
      const { args } = JSON.parse(readFileSync(join(CASES, file), 'utf8')) as { args: string[] };
      const record = await runCase(args);
      const goldenPath = join(GOLDEN, `${name}.json`);
      const serialised = `${JSON.stringify(record, null, 2)}\n`;
      if (UPDATE) writeFileSync(goldenPath, serialised);
      expect(
        existsSync(goldenPath),
        `missing golden ${goldenPath}; run with UPDATE_GOLDEN=1 and check it by hand`,
      ).toBe(true);
      expect(JSON.parse(serialised)).toEqual(JSON.parse(readFileSync(goldenPath, 'utf8')));
    });
  }
});
