import { cn } from '../../../lib/cn';
import { useHealth } from '../api/get-health';

/** A one-line account of the server and its database, for the page footer. */
export function ServerStatus() {
  const { data, isPending, isError } = useHealth();
  const state = isPending
    ? 'checking'
    : isError
      ? 'unreachable'
      : data.database.state === 'up'
        ? 'up'
        : 'database down';
  return (
    <p className="flex items-center gap-2 text-sm text-abyss-soft" aria-live="polite">
      <span
        aria-hidden="true"
        className={cn(
          'inline-block size-2 rounded-full',
          state === 'up' ? 'bg-kelp' : state === 'checking' ? 'bg-sand' : 'bg-red-700',
        )}
      />
      <span>
        Server: {state}
        {data ? ` · Leadline ${data.version}` : ''}
      </span>
    </p>
  );
}
