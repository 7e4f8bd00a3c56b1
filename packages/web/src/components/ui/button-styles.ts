import { cn } from '../../lib/cn';

/** The site's button looks. */
export type ButtonVariant = 'primary' | 'secondary' | 'quiet';

const BASE =
  'inline-flex min-h-9 min-w-9 items-center justify-center gap-1 rounded-md px-2 text-sm font-medium transition-colors focus-visible:outline-3 focus-visible:outline-offset-2 focus-visible:outline-kelp disabled:cursor-not-allowed disabled:opacity-60';

const VARIANTS: Record<ButtonVariant, string> = {
  primary: 'bg-abyss px-4 text-foam hover:bg-abyss-soft',
  secondary: 'border border-abyss/30 bg-white text-abyss hover:bg-foam',
  quiet: 'text-abyss hover:bg-foam',
};

/** Class names for a button (or a link styled as one). */
export function buttonStyles(variant: ButtonVariant = 'secondary', className?: string): string {
  return cn(BASE, VARIANTS[variant], className);
}
