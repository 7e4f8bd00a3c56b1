import type { UploadResult } from '../api/upload-log-file';

/** Where one chosen file stands on its way into the archive. */
export type UploadItemState =
  | { phase: 'waiting' }
  | { phase: 'uploading'; loadedBytes: number; totalBytes: number }
  /** Archived (new, or the same bytes were already there); its processing is followed by log id. */
  | { phase: 'archived'; logId: string; existing: boolean }
  /** The server read the file and refused it as a log. */
  | { phase: 'rejected'; message: string }
  /** The upload itself failed (too large, no permission, network). */
  | { phase: 'failed'; status: number; message: string };

/** One file chosen for upload, with the project it goes to. */
export interface UploadItem {
  key: string;
  fileName: string;
  sizeBytes: number;
  organisationId: string;
  projectId: string;
  state: UploadItemState;
}

/** What changes the list of uploads. */
export type UploadAction =
  | { type: 'add'; items: UploadItem[] }
  | { type: 'progress'; key: string; loadedBytes: number; totalBytes: number }
  | { type: 'settled'; key: string; result: UploadResult }
  | { type: 'failed'; key: string; status: number; message: string }
  | { type: 'retry'; key: string }
  | { type: 'clear-finished' };

function update(items: UploadItem[], key: string, state: UploadItemState): UploadItem[] {
  return items.map((item) => (item.key === key ? { ...item, state } : item));
}

/** Turns the server's answer for a file into the item's state. */
export function stateFromResult(result: UploadResult): UploadItemState {
  if (result.status === 'rejected' || result.log === undefined)
    return { phase: 'rejected', message: result.error?.message ?? 'The server could not read the file as a log.' };
  return { phase: 'archived', logId: result.log.id, existing: result.status === 'existing' };
}

/** The upload list's reducer. */
export function reduceUploads(items: UploadItem[], action: UploadAction): UploadItem[] {
  switch (action.type) {
    case 'add':
      return [...items, ...action.items];
    case 'progress':
      return update(items, action.key, {
        phase: 'uploading',
        loadedBytes: action.loadedBytes,
        totalBytes: action.totalBytes,
      });
    case 'settled':
      return update(items, action.key, stateFromResult(action.result));
    case 'failed':
      return update(items, action.key, { phase: 'failed', status: action.status, message: action.message });
    case 'retry':
      return update(items, action.key, { phase: 'waiting' });
    case 'clear-finished':
      return items.filter((item) => item.state.phase === 'waiting' || item.state.phase === 'uploading');
  }
}

/** Share of the bytes sent, 0–1. */
export function uploadedShare(state: UploadItemState): number {
  if (state.phase === 'waiting') return 0;
  if (state.phase === 'uploading') return state.totalBytes > 0 ? Math.min(1, state.loadedBytes / state.totalBytes) : 0;
  return 1;
}

/** `12.3 MB`, `840 kB`, `512 B` (SI units). */
export function formatBytes(bytes: number): string {
  if (bytes >= 1e6) return `${(bytes / 1e6).toFixed(1)} MB`;
  if (bytes >= 1e3) return `${Math.round(bytes / 1e3)} kB`;
  return `${bytes} B`;
}
