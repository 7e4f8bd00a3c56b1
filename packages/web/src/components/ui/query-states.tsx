import type { ReactNode } from 'react';
import { ApiError } from '../../lib/api-client';
import { buttonStyles } from './button-styles';

/** A quiet "working on it" line for a region that is loading. */
export function LoadingState({ label = 'Loading…' }: { label?: string }) {
  return (
    <div role="status" className="flex items-center gap-3 py-10 text-abyss-soft">
      <span
        aria-hidden="true"
        className="inline-block size-5 animate-spin rounded-full border-2 border-kelp border-t-transparent motion-reduce:animate-none"
      />
      {label}
    </div>
  );
}

/** Says what went wrong and offers to try again. */
export function ErrorState({ title, error, onRetry }: { title: string; error: unknown; onRetry?: () => void }) {
  const detail =
    error instanceof ApiError
      ? `${error.message} (${error.status === 0 ? 'no answer' : `HTTP ${error.status}`})`
      : error instanceof Error
        ? error.message
        : String(error);
  return (
    <div
      role="alert"
      className="flex flex-col items-start gap-3 rounded-lg border border-[#9c211a]/30 bg-[#fbe4e2] p-5"
    >
      <h2 className="font-semibold text-[#7d1a14]">{title}</h2>
      <p className="text-sm text-[#7d1a14]">{detail}</p>
      {onRetry ? (
        <button type="button" className={buttonStyles('secondary')} onClick={onRetry}>
          Try again
        </button>
      ) : null}
    </div>
  );
}

/** Says there is nothing to show, and what to do about it. */
export function EmptyState({ title, children }: { title: string; children?: ReactNode }) {
  return (
    <div className="flex flex-col items-start gap-2 rounded-lg border border-dashed border-abyss/30 bg-white p-6">
      <h2 className="font-semibold">{title}</h2>
      {children ? <div className="text-sm text-abyss-soft">{children}</div> : null}
    </div>
  );
}
