import { type ReactNode, useState } from 'react';
import { buttonStyles } from './button-styles';
import { FormFailure } from './form-failure';

/**
 * A destructive action asked twice: a secondary button first, then a red confirmation with a way
 * back, the pending label while it runs and the server's refusal when there is one.
 */
export function ConfirmAction({
  label,
  accessibleLabel,
  legend,
  warning,
  confirmLabel,
  pendingLabel,
  keepLabel = 'Keep it',
  isPending,
  error,
  onConfirm,
}: {
  /** The first button's text (`Remove`). */
  label: string;
  /** The first button's accessible name, naming what it acts on (`Remove Tomas Reyne`). */
  accessibleLabel: string;
  /** Read by screen readers for the confirmation group. */
  legend: string;
  /** A consequence shown beside the confirmation. */
  warning?: ReactNode;
  confirmLabel: string;
  pendingLabel: string;
  keepLabel?: string;
  isPending: boolean;
  error: unknown;
  /** Runs the action; call `done` on success to fold the confirmation away. */
  onConfirm: (done: () => void) => void;
}) {
  const [confirming, setConfirming] = useState(false);
  if (!confirming)
    return (
      <button
        type="button"
        className={buttonStyles('secondary')}
        aria-label={accessibleLabel}
        onClick={() => setConfirming(true)}
      >
        {label}
      </button>
    );
  return (
    <fieldset className="flex flex-wrap items-center gap-2">
      <legend className="sr-only">{legend}</legend>
      {warning ? <span className="text-sm">{warning}</span> : null}
      <button
        type="button"
        className={buttonStyles('primary', 'bg-[#9c211a] hover:bg-[#7d1a14]')}
        disabled={isPending}
        onClick={() => onConfirm(() => setConfirming(false))}
      >
        {isPending ? pendingLabel : confirmLabel}
      </button>
      <button type="button" className={buttonStyles('quiet')} onClick={() => setConfirming(false)}>
        {keepLabel}
      </button>
      <FormFailure error={error} />
    </fieldset>
  );
}
