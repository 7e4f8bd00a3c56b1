import { cn } from '../../../lib/cn';
import { formatClockUtc, formatCount } from '../lib/format';
import type { DiveFinding } from '../types';
import { SeverityBadge } from './severity-badge';

/** Props of the findings list. */
export interface FindingsListProps {
  findings: readonly DiveFinding[];
  selectedId: string | undefined;
  /** Called with the chosen finding, or `undefined` when the chosen one is chosen again. */
  onSelect: (finding: DiveFinding | undefined) => void;
}

/** The audit's findings; choosing one highlights its span on both plots. */
export function FindingsList({ findings, selectedId, onSelect }: FindingsListProps) {
  return (
    <section aria-labelledby="findings-heading" className="flex flex-col gap-2">
      <h2 id="findings-heading" className="text-base font-semibold">
        Findings <span className="font-normal text-abyss-soft">({findings.length})</span>
      </h2>
      {findings.length === 0 ? (
        <p className="text-sm text-abyss-soft">The audit found nothing to report for this dive.</p>
      ) : (
        <ul className="flex max-h-96 flex-col gap-1 overflow-y-auto pr-1">
          {findings.map((finding) => {
            const selected = finding.id === selectedId;
            const fixes =
              finding.startIndex === finding.endIndex
                ? `fix ${formatCount(finding.startIndex + 1)}`
                : `fixes ${formatCount(finding.startIndex + 1)}–${formatCount(finding.endIndex + 1)}`;
            return (
              <li key={finding.id}>
                <button
                  type="button"
                  aria-pressed={selected}
                  onClick={() => onSelect(selected ? undefined : finding)}
                  className={cn(
                    'flex w-full flex-col gap-1 rounded-md border px-3 py-2 text-left text-sm transition-colors focus-visible:outline-3 focus-visible:outline-offset-1 focus-visible:outline-kelp',
                    selected ? 'border-abyss bg-sand/40' : 'border-abyss/15 bg-white hover:bg-foam',
                  )}
                >
                  <span className="flex flex-wrap items-center gap-2">
                    <SeverityBadge level={finding.severity} />
                    <span className="font-medium">{finding.check}</span>
                    <span className="ml-auto text-xs tabular-nums text-abyss-soft">
                      {formatClockUtc(finding.startTimeMs)}
                      {finding.endTimeMs !== finding.startTimeMs ? `–${formatClockUtc(finding.endTimeMs)}` : ''} UTC
                    </span>
                  </span>
                  <span>{finding.message}</span>
                  <span className="text-xs text-abyss-soft">{fixes}</span>
                </button>
              </li>
            );
          })}
        </ul>
      )}
    </section>
  );
}
