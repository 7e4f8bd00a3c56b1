import { cleanup, fireEvent, render, screen, within } from '@testing-library/react';
import { MemoryRouter } from 'react-router-dom';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { UploadItem } from '../lib/upload-items';
import { ProcessingStatusView } from './processing-status';
import { UploadList } from './upload-list';

afterEach(cleanup);

const base = { organisationId: 'org', projectId: 'project', sizeBytes: 84_000 };
const run = (status: 'queued' | 'processing' | 'done' | 'failed', reason: string | null = null) => ({
  id: 'run-1',
  kind: 'process' as const,
  status,
  reason,
  auditProfile: 'inspection-rov',
  createdAt: '2026-06-14T10:00:00.000Z',
  finishedAt: null,
});

describe('UploadList', () => {
  it('shows each file in its state: waiting, sending with progress, archived, unreadable, too large', () => {
    const items: UploadItem[] = [
      { ...base, key: 'a', fileName: 'a.csv', state: { phase: 'waiting' } },
      { ...base, key: 'b', fileName: 'b.csv', state: { phase: 'uploading', loadedBytes: 21_000, totalBytes: 84_000 } },
      { ...base, key: 'c', fileName: 'c.csv', state: { phase: 'archived', logId: 'log-c', existing: false } },
      { ...base, key: 'd', fileName: 'd.bin', state: { phase: 'rejected', message: 'd.bin: binary data, not a log' } },
      { ...base, key: 'e', fileName: 'e.csv', state: { phase: 'failed', status: 413, message: 'Larger than 1 MB.' } },
      { ...base, key: 'f', fileName: 'f.csv', state: { phase: 'failed', status: 0, message: 'Network error.' } },
    ];
    const onRetry = vi.fn();
    render(
      <UploadList
        items={items}
        onRetry={onRetry}
        renderProcessing={(item) => <p>processing of {item.state.logId}</p>}
      />,
    );
    const rows = within(screen.getByRole('list', { name: 'Uploads' })).getAllByRole('listitem');
    expect(rows).toHaveLength(6);
    expect(screen.getByRole('progressbar', { name: 'Uploading a.csv' }).getAttribute('aria-valuenow')).toBe('0');
    expect(within(rows[0] as HTMLElement).getByText('Waiting')).toBeTruthy();
    expect(screen.getByRole('progressbar', { name: 'Uploading b.csv' }).getAttribute('aria-valuenow')).toBe('25');
    expect(within(rows[1] as HTMLElement).getByText('25 % sent')).toBeTruthy();
    expect(within(rows[2] as HTMLElement).getByText('Uploaded and archived.')).toBeTruthy();
    expect(within(rows[2] as HTMLElement).getByText('processing of log-c')).toBeTruthy();
    expect(within(rows[3] as HTMLElement).getByRole('alert').textContent).toMatch(/Not a readable log.*binary data/);
    // 413: said plainly, and no retry (the same file would be refused again).
    const tooLarge = within(rows[4] as HTMLElement).getByRole('alert');
    expect(tooLarge.textContent).toMatch(/Too large for the server: Larger than 1 MB\./);
    expect(within(tooLarge).queryByRole('button')).toBeNull();
    fireEvent.click(within(rows[5] as HTMLElement).getByRole('button', { name: 'Try again' }));
    expect(onRetry).toHaveBeenCalledWith('f');
  });

  it('renders nothing without uploads', () => {
    const { container } = render(<UploadList items={[]} onRetry={() => {}} />);
    expect(container.textContent).toBe('');
  });
});

describe('ProcessingStatusView', () => {
  it('says the log is queued, then processing, while waiting', () => {
    const { rerender } = render(<ProcessingStatusView run={run('queued')} dives={undefined} />);
    expect(screen.getByText('Queued for processing')).toBeTruthy();
    rerender(<ProcessingStatusView run={run('processing')} dives={undefined} />);
    expect(screen.getByText('Processing')).toBeTruthy();
  });

  it('gives the reason of a failed run', () => {
    render(<ProcessingStatusView run={run('failed', 'unknown profile "custom-sled"')} dives={undefined} />);
    expect(screen.getByText('Processing failed')).toBeTruthy();
    expect(screen.getByText('unknown profile "custom-sled"')).toBeTruthy();
  });

  it('links each dive of a processed log with its verdict', () => {
    render(
      <MemoryRouter>
        <ProcessingStatusView
          run={run('done')}
          dives={[
            { id: 'dive-1', diveNumber: 1, verdict: 'warn', fixCount: 1200, startTime: null },
            { id: 'dive-2', diveNumber: 2, verdict: 'pass', fixCount: 900, startTime: null },
          ]}
        />
      </MemoryRouter>,
    );
    expect(screen.getByText('Processed')).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Dive 1' }).getAttribute('href')).toBe('/dives/dive-1');
    const dives = within(screen.getByRole('list', { name: 'Dives of this log' })).getAllByRole('listitem');
    expect(dives.map((li) => li.textContent)).toEqual(['Dive 1▲warn', 'Dive 2✓pass']);
  });

  it('says so when a processed log held no dive', () => {
    render(<ProcessingStatusView run={run('done')} dives={[]} />);
    expect(screen.getByText('No dive was found in this log.')).toBeTruthy();
  });

  it('offers to ask again when the status could not be read', () => {
    const onRetry = vi.fn();
    render(<ProcessingStatusView run={undefined} dives={undefined} error={new Error('offline')} onRetry={onRetry} />);
    expect(screen.getByRole('alert').textContent).toMatch(/could not be read: offline/);
    fireEvent.click(screen.getByRole('button', { name: 'Try again' }));
    expect(onRetry).toHaveBeenCalledTimes(1);
  });
});
