import type { ReactNode } from 'react';
import { buttonStyles } from '../../../components/ui/button-styles';
import { formatBytes, type UploadItem, uploadedShare } from '../lib/upload-items';
import { ProcessingStatus } from './processing-status';

/** Props of the list of uploads. */
export interface UploadListProps {
  items: readonly UploadItem[];
  onRetry: (key: string) => void;
  /** Draws an archived log's processing; the live status by default (tests pass a stand-in). */
  renderProcessing?: (item: UploadItem & { state: { phase: 'archived' } }) => ReactNode;
}

function failureText(status: number, message: string): string {
  if (status === 413) return `Too large for the server: ${message}`;
  if (status === 403) return `Not allowed: ${message}`;
  if (status === 0) return message;
  return `${message} (HTTP ${status})`;
}

function UploadRow({ item, onRetry, renderProcessing }: { item: UploadItem } & Omit<UploadListProps, 'items'>) {
  const { state } = item;
  const share = uploadedShare(state);
  const percent = Math.round(share * 100);
  return (
    <li className="flex flex-col gap-2 rounded-lg border border-abyss/15 bg-white p-3" data-upload-phase={state.phase}>
      <div className="flex flex-wrap items-baseline gap-x-3">
        <span className="mr-auto font-medium break-all">{item.fileName}</span>
        <span className="text-sm text-abyss-soft">{formatBytes(item.sizeBytes)}</span>
      </div>
      {state.phase === 'waiting' || state.phase === 'uploading' ? (
        <div className="flex items-center gap-3">
          <div
            role="progressbar"
            aria-label={`Uploading ${item.fileName}`}
            aria-valuemin={0}
            aria-valuemax={100}
            aria-valuenow={percent}
            className="h-2 flex-1 overflow-hidden rounded-full bg-foam"
          >
            <div className="h-full rounded-full bg-kelp transition-[width]" style={{ width: `${percent}%` }} />
          </div>
          <span className="w-24 text-right text-sm tabular-nums text-abyss-soft">
            {state.phase === 'waiting' ? 'Waiting' : `${percent} % sent`}
          </span>
        </div>
      ) : null}
      {state.phase === 'archived' ? (
        <>
          <p className="text-sm text-abyss-soft">
            {state.existing
              ? 'Already in the archive (the same bytes were uploaded before).'
              : 'Uploaded and archived.'}
          </p>
          {renderProcessing ? (
            renderProcessing({ ...item, state })
          ) : (
            <ProcessingStatus organisationId={item.organisationId} projectId={item.projectId} logId={state.logId} />
          )}
        </>
      ) : null}
      {state.phase === 'rejected' ? (
        <p role="alert" className="text-sm text-[#7d1a14]">
          <span className="font-semibold">Not a readable log.</span> {state.message}
        </p>
      ) : null}
      {state.phase === 'failed' ? (
        <div role="alert" className="flex flex-wrap items-center gap-2 text-sm text-[#7d1a14]">
          <span className="font-semibold">Upload failed.</span> {failureText(state.status, state.message)}
          {state.status === 413 ? null : (
            <button type="button" className={buttonStyles('secondary')} onClick={() => onRetry(item.key)}>
              Try again
            </button>
          )}
        </div>
      ) : null}
    </li>
  );
}

/** Every file chosen in this visit, with its upload progress, then its processing. */
export function UploadList({ items, onRetry, renderProcessing }: UploadListProps) {
  if (items.length === 0) return null;
  return (
    <ul className="flex flex-col gap-2" aria-label="Uploads">
      {items.map((item) => (
        <UploadRow key={item.key} item={item} onRetry={onRetry} renderProcessing={renderProcessing} />
      ))}
    </ul>
  );
}
