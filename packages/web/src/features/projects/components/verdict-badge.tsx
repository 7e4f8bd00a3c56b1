import { cn } from '../../../lib/cn';
import type { Verdict } from '../types';

// Text on tinted fills, each pair above 4.5:1 (WCAG 2.2 AA); the word carries the meaning, not the colour.
const LOOKS: Record<Verdict, string> = {
  pass: 'bg-[#dff3e4] text-[#1d5b2c]',
  warn: 'bg-[#fdf0cf] text-[#6b4a00]',
  fail: 'bg-[#fbe4e2] text-[#7d1a14]',
};

/** A dive's verdict as a small labelled badge; "not audited" when there is none yet. */
export function VerdictBadge({ verdict }: { verdict: Verdict | null }) {
  if (verdict === null) return <span className="text-sm text-abyss-soft">not audited</span>;
  return (
    <span
      className={cn('inline-block rounded px-2 py-0.5 text-xs font-semibold uppercase tracking-wide', LOOKS[verdict])}
    >
      {verdict}
    </span>
  );
}
