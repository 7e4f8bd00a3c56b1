import { useSearchParams } from 'react-router-dom';
import { ErrorState, LoadingState } from '../../components/ui/query-states';
import { PREVIEW_FIX_LIMITS, usePreviewDive } from '../../features/dives/api/get-preview-dive';
import { DiveView } from '../../features/dives/components/dive-view';
import { useTileSource } from '../../features/site-settings/api/get-site-settings';

function readInteger(value: string | null, fallback: number, min: number, max: number): number {
  const parsed = value === null ? Number.NaN : Number.parseInt(value, 10);
  return Number.isFinite(parsed) ? Math.min(max, Math.max(min, parsed)) : fallback;
}

/** The dive view on a dive simulated in the browser, clearly marked as a preview (`?fixes=50000&seed=7`). */
export function PreviewDivePage() {
  const [params] = useSearchParams();
  const fixCount = readInteger(
    params.get('fixes'),
    PREVIEW_FIX_LIMITS.default,
    PREVIEW_FIX_LIMITS.min,
    PREVIEW_FIX_LIMITS.max,
  );
  const seed = readInteger(params.get('seed'), 1, 0, 2 ** 31 - 1);
  const dive = usePreviewDive(fixCount, seed);
  const tileSource = useTileSource();
  const banner = (
    <div role="note" aria-label="Preview" className="rounded-lg border-2 border-dashed border-sand-deep bg-sand/25 p-4">
      <p className="font-semibold">
        <span className="mr-2 rounded bg-abyss px-2 py-0.5 text-xs font-semibold tracking-wide text-foam uppercase">
          Preview
        </span>
        A dive simulated in your browser, not a dive from the archive
      </p>
      <p className="mt-1 text-sm text-abyss-soft">
        Core&rsquo;s simulator invented this dive (an invented site of the invented operator Hollowtide Subsea, seed{' '}
        {seed}, about {fixCount.toLocaleString('en-GB')} fixes, with noise and injected faults); core&rsquo;s audit
        found the findings. Nothing here was measured. Other dives: add <code>?seed=2</code> or{' '}
        <code>?fixes=50000</code> to the address.
      </p>
    </div>
  );
  if (dive.isPending)
    return (
      <div className="flex flex-col gap-4">
        {banner}
        <LoadingState label="Simulating the dive…" />
      </div>
    );
  if (dive.isError)
    return (
      <div className="flex flex-col gap-4">
        {banner}
        <ErrorState title="The preview dive could not be made" error={dive.error} onRetry={() => dive.refetch()} />
      </div>
    );
  return <DiveView data={dive.data} banner={banner} tileSource={tileSource} />;
}
