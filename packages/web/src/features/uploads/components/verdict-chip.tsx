import { cn } from '../../../lib/cn';

type Verdict = 'pass' | 'warn' | 'fail';

// Dark text on light tints keeps 4.5:1 or better (WCAG 1.4.3); the shape says it without colour.
const STYLES: Record<Verdict, string> = {
  pass: 'bg-[#e3f1ea] text-[#1d5c3f] border-[#1d5c3f]/30',
  warn: 'bg-[#fbeed5] text-[#7a4600] border-[#7a4600]/30',
  fail: 'bg-[#fbe4e2] text-[#9c211a] border-[#9c211a]/30',
};
const SHAPES: Record<Verdict, string> = { pass: '✓', warn: '▲', fail: '■' };

/** A dive's verdict as a small labelled chip. */
export function VerdictChip({ verdict }: { verdict: Verdict }) {
  return (
    <span
      className={cn(
        'inline-flex items-center gap-1 rounded border px-1.5 py-0.5 text-xs font-semibold uppercase tracking-wide',
        STYLES[verdict],
      )}
    >
      <span aria-hidden="true">{SHAPES[verdict]}</span>
      {verdict}
    </span>
  );
}
