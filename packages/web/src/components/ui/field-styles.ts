import { cn } from '../../lib/cn';

/** Class names for a text input or select, red-bordered while it holds an error. */
export function fieldStyles(hasError: boolean, className?: string): string {
  return cn(
    'min-h-10 w-full rounded-md border bg-white px-3 text-base focus-visible:outline-3 focus-visible:outline-offset-1 focus-visible:outline-kelp disabled:bg-foam disabled:text-abyss-soft',
    hasError ? 'border-[#9c211a]' : 'border-abyss/30',
    className,
  );
}
