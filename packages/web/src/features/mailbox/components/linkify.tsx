import type { ReactNode } from 'react';

const URL_PATTERN = /(https?:\/\/[^\s<>"]+)/g;

/** A plain-text message with every http(s) address made a link. */
export function Linkify({ text }: { text: string }) {
  const parts: ReactNode[] = text.split(URL_PATTERN).map((part, index) =>
    index % 2 === 1 ? (
      // biome-ignore lint/suspicious/noArrayIndexKey: the parts of one fixed text never reorder
      <a key={index} href={part} className="break-all font-medium text-abyss-soft underline underline-offset-2">
        {part}
      </a>
    ) : (
      part
    ),
  );
  return <>{parts}</>;
}
