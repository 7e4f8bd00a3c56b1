import { formatCount, formatDateTimeUtc, formatDuration, formatQuantity, formatShare } from '../lib/format';
import type { DiveSummaryView } from '../types';

/** The dive's summary as a definition list. */
export function SummaryPanel({ summary }: { summary: DiveSummaryView }) {
  const rows: [string, string][] = [
    ['Start', formatDateTimeUtc(summary.startTimeMs)],
    ['End', formatDateTimeUtc(summary.endTimeMs)],
    ['Duration', formatDuration(summary.durationS)],
    ['Fixes', formatCount(summary.fixCount)],
    ['Fix rate', formatQuantity(summary.meanFixRateHz, 'Hz', 2)],
    ['Distance (horizontal)', formatQuantity(summary.distanceM, 'm', 0)],
    ['Distance (3-D)', formatQuantity(summary.distance3dM, 'm', 0)],
    ['Max depth', formatQuantity(summary.maxDepthM, 'm')],
    ['Mean depth', formatQuantity(summary.meanDepthM, 'm')],
    ['Time on bottom', formatDuration(summary.timeOnBottomS)],
    ['Max horizontal range', formatQuantity(summary.maxHorizontalRangeM, 'm')],
    ['Max slant range', formatQuantity(summary.maxSlantRangeM, 'm')],
    ['Flagged fixes', formatShare(summary.flaggedShare)],
  ];
  return (
    <section aria-labelledby="summary-heading" className="flex flex-col gap-2">
      <h2 id="summary-heading" className="text-base font-semibold">
        Summary
      </h2>
      <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm">
        {rows.map(([term, value]) => (
          <div key={term} className="contents">
            <dt className="text-abyss-soft">{term}</dt>
            <dd className="text-right tabular-nums">{value}</dd>
          </div>
        ))}
      </dl>
    </section>
  );
}
