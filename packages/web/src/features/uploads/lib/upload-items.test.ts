import { describe, expect, it } from 'vitest';
import { formatBytes, reduceUploads, type UploadItem, uploadedShare } from './upload-items';

const item = (key: string): UploadItem => ({
  key,
  fileName: `${key}.csv`,
  sizeBytes: 2000,
  organisationId: 'org',
  projectId: 'project',
  state: { phase: 'waiting' },
});

describe('reduceUploads', () => {
  it('follows a file from waiting through progress to archived, and an unreadable one to rejected', () => {
    let items = reduceUploads([], { type: 'add', items: [item('a'), item('b')] });
    items = reduceUploads(items, { type: 'progress', key: 'a', loadedBytes: 500, totalBytes: 2000 });
    expect(uploadedShare(items[0]?.state ?? { phase: 'waiting' })).toBe(0.25);
    items = reduceUploads(items, {
      type: 'settled',
      key: 'a',
      result: {
        fileName: 'a.csv',
        status: 'existing',
        log: { id: 'log-a', projectId: 'project', originalFileName: 'a.csv', sizeBytes: 2000, sha256: 'x' },
      },
    });
    expect(items[0]?.state).toEqual({ phase: 'archived', logId: 'log-a', existing: true });
    items = reduceUploads(items, {
      type: 'settled',
      key: 'b',
      result: { fileName: 'b.csv', status: 'rejected', error: { code: 'unreadable', message: 'line 1: no header' } },
    });
    expect(items[1]?.state).toEqual({ phase: 'rejected', message: 'line 1: no header' });
    expect(reduceUploads(items, { type: 'clear-finished' })).toEqual([]);
  });

  it('keeps a failed upload until it is tried again', () => {
    let items = reduceUploads([item('a')], { type: 'failed', key: 'a', status: 413, message: 'too large' });
    expect(items[0]?.state).toEqual({ phase: 'failed', status: 413, message: 'too large' });
    items = reduceUploads(items, { type: 'retry', key: 'a' });
    expect(items[0]?.state).toEqual({ phase: 'waiting' });
  });
});

describe('formatBytes', () => {
  it('writes SI sizes', () => {
    expect(formatBytes(512)).toBe('512 B');
    expect(formatBytes(84_000)).toBe('84 kB');
    expect(formatBytes(12_345_678)).toBe('12.3 MB');
  });
});
