import { useState } from 'react';
import { buttonStyles } from './button-styles';

type CopyState = 'idle' | 'copied' | 'failed';

/** Copies a text to the clipboard and says whether it worked (in a live region beside it). */
export function CopyButton({ text, label }: { text: string; label: string }) {
  const [state, setState] = useState<CopyState>('idle');
  const copy = async () => {
    try {
      await navigator.clipboard.writeText(text);
      setState('copied');
    } catch {
      setState('failed');
    }
  };
  return (
    <span className="inline-flex items-center gap-2">
      <button type="button" className={buttonStyles('secondary')} onClick={copy}>
        {label}
      </button>
      <span role="status" className="text-sm text-abyss-soft">
        {state === 'copied' ? 'Copied.' : state === 'failed' ? 'Copying was refused; select the text instead.' : ''}
      </span>
    </span>
  );
}
