import { formatCount, formatShare } from '../lib/format';
import type { S44ShareView } from '../types';

/** The share of fixes meeting each IHO S-44 order, as labelled bars. */
export function S44Panel({ shares }: { shares: readonly S44ShareView[] }) {
  return (
    <section aria-labelledby="s44-heading" className="flex flex-col gap-2">
      <h2 id="s44-heading" className="text-base font-semibold">
        IHO S-44 orders met
      </h2>
      {shares.length === 0 ? (
        <p className="text-sm text-abyss-soft">No uncertainty estimate for this dive.</p>
      ) : (
        <ul className="flex flex-col gap-2 text-sm">
          {shares.map((row) => {
            const percent = row.share === null ? 0 : Math.round(row.share * 1000) / 10;
            return (
              <li key={row.order} className="grid grid-cols-[7rem_1fr_4rem] items-center gap-2">
                <span>Order {row.label}</span>
                <meter
                  min={0}
                  max={1}
                  value={row.share ?? 0}
                  aria-label={`Order ${row.label}`}
                  aria-valuetext={`${formatShare(row.share)} of ${formatCount(row.judged)} judged fixes`}
                  className="sr-only"
                />
                <span aria-hidden="true" className="h-3 overflow-hidden rounded-sm border border-abyss/25 bg-foam">
                  <span className="block h-full bg-kelp" style={{ width: `${percent}%` }} />
                </span>
                <span className="text-right tabular-nums">{formatShare(row.share)}</span>
              </li>
            );
          })}
        </ul>
      )}
      <p className="text-xs text-abyss-soft">
        Share of unflagged fixes whose estimated 95 % horizontal and vertical uncertainties are within the order&rsquo;s
        limits at the fix&rsquo;s depth (S-44 Ed. 6.0.0, Table 1).
      </p>
    </section>
  );
}
