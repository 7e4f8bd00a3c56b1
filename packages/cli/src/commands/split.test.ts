import { mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { readLog } from '@leadline/core';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import type { CliIo } from '../io.js';
import { main } from '../main.js';
import { runSplit, type SplitCliOptions, type SplitFileReport } from './split.js';

function capture(): CliIo & { out: () => string; err: () => string } {
  const out: string[] = [];
  const err: string[] = [];
  return {
    isTty: false,
    stdout: (t) => out.push(t),
    stderr: (t) => err.push(t),
    out: () => out.join(''),
    err: () => err.join(''),
  };
}

const base: SplitCliOptions = { to: 'csv', jobs: 1, json: true, quiet: false, progress: false, force: false };

/** A day log of Hollowtide Subsea's (invented) quay survey: two dives, a long surface stay, then a long gap and a third dive. */
function dayLog(): string {
  const lines = ['time_utc,lat,lon,depth_m'];
  let t = Date.UTC(2026, 5, 3, 8, 0, 0);
  const add = (count: number, depth: number) => {
    for (let i = 0; i < count; i++) {
      lines.push(`${new Date(t).toISOString()},59.3125,${(5.4106 + i * 1e-6).toFixed(7)},${depth.toFixed(1)}`);
      t += 1000;
    }
  };
  add(120, 12);
  add(400, 0.2);
  add(90, 18);
  t += 3600_000;
  add(60, 7);
  return `${lines.join('\n')}\n`;
}

let dir: string;
beforeEach(() => {
  dir = mkdtempSync(join(tmpdir(), 'leadline-split-'));
  writeFileSync(join(dir, 'quay-day.csv'), dayLog());
});
afterEach(() => rmSync(dir, { recursive: true, force: true }));

describe('runSplit', () => {
  it('splits at the long surface stay and the long gap, accounting for every fix', async () => {
    const io = capture();
    expect(await runSplit(['quay-day.csv'], base, io, dir)).toBe(0);
    const [report] = JSON.parse(io.out()) as SplitFileReport[];
    expect(report?.dives.map((d) => [d.startIndex, d.endIndex, d.fixCount])).toEqual([
      [0, 119, 120],
      [520, 609, 90],
      [610, 669, 60],
    ]);
    expect(report?.surfaceIntervals.map((s) => [s.startIndex, s.endIndex])).toEqual([[120, 519]]);
    const covered = [...(report?.dives ?? []), ...(report?.surfaceIntervals ?? [])].reduce((n, s) => n + s.fixCount, 0);
    expect(covered).toBe(report?.fixCount);
    expect(report?.dives[2]?.startTime).toBe('2026-06-03T09:10:10.000Z');
  });

  it('honours --gap and --surface-time', async () => {
    const io = capture();
    await runSplit(['quay-day.csv'], { ...base, gap: 7200, surfaceTime: 1000 }, io, dir);
    const [report] = JSON.parse(io.out()) as SplitFileReport[];
    expect(report?.dives).toHaveLength(1);
  });

  it('writes one readable file per dive and the run manifest under --out', async () => {
    const out = join(dir, 'dives');
    expect(await runSplit(['quay-day.csv'], { ...base, json: false, quiet: true, out }, capture(), dir)).toBe(0);
    const files = readdirSync(out).sort();
    expect(files).toEqual([
      'leadline-run.json',
      'quay-day.dive-01.csv',
      'quay-day.dive-02.csv',
      'quay-day.dive-03.csv',
    ]);
    const back = readLog({
      fileName: 'quay-day.dive-02.csv',
      content: readFileSync(join(out, 'quay-day.dive-02.csv')),
    });
    expect(back.rejections).toEqual([]);
    expect(back.tracks[0]?.length).toBe(90);
  });

  it('exits 2 for an unknown profile and 3 for an unreadable input', async () => {
    const io = capture();
    expect(await runSplit(['quay-day.csv'], { ...base, profile: 'glider' }, io, dir)).toBe(2);
    writeFileSync(join(dir, 'empty.csv'), '');
    expect(await runSplit(['empty.csv'], base, capture(), dir)).toBe(3);
  });
});

describe('leadline split (through main)', () => {
  it('has --help with examples', async () => {
    const io = capture();
    await main(['split', '--help'], io);
    expect(io.out()).toContain('Examples:');
    expect(io.out()).toContain('--gap');
  });
});
