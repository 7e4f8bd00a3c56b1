import { cn } from '../../../lib/cn';
import type { Severity, Verdict } from '../types';

// Text colours on their tints keep 4.5:1 or better (WCAG 1.4.3).
const STYLES: Record<Severity | 'pass', string> = {
  pass: 'bg-[#e3f1ea] text-[#1d5c3f] border-[#1d5c3f]/30',
  info: 'bg-[#e4eefa] text-[#1a4f8c] border-[#1a4f8c]/30',
  warn: 'bg-[#fbeed5] text-[#7a4600] border-[#7a4600]/30',
  fail: 'bg-[#fbe4e2] text-[#9c211a] border-[#9c211a]/30',
};

const SHAPES: Record<Severity | 'pass', string> = { pass: '✓', info: '●', warn: '▲', fail: '■' };

/** A severity or verdict as a small labelled badge (shape and word, not colour alone). */
export function SeverityBadge({ level, className }: { level: Severity | Verdict; className?: string }) {
  return (
    <span
      className={cn(
        'inline-flex items-center gap-1 rounded border px-1.5 py-0.5 text-xs font-semibold uppercase tracking-wide',
        STYLES[level],
        className,
      )}
    >
      <span aria-hidden="true">{SHAPES[level]}</span>
      {level}
    </span>
  );
}
