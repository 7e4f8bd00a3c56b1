import { threadId } from 'node:worker_threads';
import { describe, expect, it } from 'vitest';
import { createTaskPool } from './task-pool.js';

const TASK = new URL('../testing/sample-task.ts', import.meta.url);

describe('createTaskPool', () => {
  it('runs tasks on worker threads when given more than one job', async () => {
    const pool = createTaskPool(2);
    try {
      const results = await Promise.all(
        [1, 2, 3, 4].map((value) =>
          pool.run<{ value: number }, { doubled: number; threadId: number }>(TASK, 'describeThread', { value }),
        ),
      );
      expect(results.map((r) => r.doubled)).toEqual([2, 4, 6, 8]);
      expect(results.every((r) => r.threadId !== threadId)).toBe(true);
    } finally {
      await pool.destroy();
    }
  });

  it('runs in this thread with one job', async () => {
    const pool = createTaskPool(1);
    const result = await pool.run<{ value: number }, { doubled: number; threadId: number }>(TASK, 'describeThread', {
      value: 5,
    });
    expect(result).toEqual({ doubled: 10, threadId });
  });

  it('says which task is missing', async () => {
    await expect(createTaskPool(1).run(TASK, 'noSuchTask', {})).rejects.toThrow(/has no task noSuchTask/);
  });
});
