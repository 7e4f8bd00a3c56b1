import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { readLog } from '@leadline/core';
import { describe, expect, it } from 'vitest';
import type { TaskPayload } from '../tasks.js';
import { sha256Hex } from './output-folder.js';
import { createTaskPool } from './task-pool.js';

const FIXTURE = new URL('../../../../fixtures/read/in/csv-plain-decimal.csv', import.meta.url).pathname;

const inspect = (path: string): TaskPayload<'inspectFile'> => ({
  source: { path },
  task: { displayName: 'csv-plain-decimal.csv', readOptions: {} },
});

describe('createTaskPool', () => {
  it('gives the same report on worker threads as in this thread, and records the input read there', async () => {
    const threads = createTaskPool(2);
    try {
      const [onThreads, again] = await Promise.all([
        threads.run('inspectFile', inspect(FIXTURE)),
        threads.run('inspectFile', inspect(FIXTURE)),
      ]);
      const here = await createTaskPool(1).run('inspectFile', inspect(FIXTURE));
      expect(onThreads).toEqual(here);
      expect(again).toEqual(here);
      const bytes = readFileSync(FIXTURE);
      expect(here.input).toEqual({ bytes: bytes.byteLength, sha256: sha256Hex(bytes) });
      const direct = readLog({ fileName: 'csv-plain-decimal.csv', content: bytes });
      expect(here.result.fixCount).toBe(direct.tracks.reduce((n, t) => n + t.length, 0));
    } finally {
      await threads.destroy();
    }
  });

  it('writes a task’s files on the worker thread and sends back only what it wrote', async () => {
    const root = mkdtempSync(join(tmpdir(), 'leadline-pool-'));
    const threads = createTaskPool(2);
    try {
      const outcome = await threads.run('convertFile', {
        source: { path: FIXTURE },
        target: { rules: { root, force: false, inputPaths: [FIXTURE] }, relativePath: 'day1/dive.csv' },
        task: { displayName: 'dive.csv', readOptions: {}, to: 'geojson', nowMs: 0 },
      });
      expect(outcome.written.map((w) => w.path)).toEqual([join('day1', 'dive.geojson')]);
      const text = readFileSync(join(root, 'day1', 'dive.geojson'), 'utf8');
      expect(outcome.written[0]?.sha256).toBe(sha256Hex(text));
      expect(outcome.result.files[0]?.content).toBe('');
    } finally {
      await threads.destroy();
      rmSync(root, { recursive: true, force: true });
    }
  });

  it('says which task is missing', async () => {
    await expect(createTaskPool(1).run('noSuchTask' as 'inspectFile', inspect(FIXTURE))).rejects.toThrow();
  });
});
