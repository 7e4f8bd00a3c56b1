import { type ReactNode, useId } from 'react';

/** What a control inside a `LabelledField` needs to be tied to its label, help line and error. */
export interface FieldControlProps {
  id: string;
  'aria-invalid': true | undefined;
  'aria-describedby': string | undefined;
}

/**
 * The frame every form field shares: a label, an optional help line, the control, and an inline
 * error, tied together by ids (`htmlFor`, `aria-describedby`) so screen readers announce them.
 */
export function LabelledField({
  label,
  error,
  hint,
  children,
}: {
  label: string;
  /** The field's validation message, shown under it and announced with it. */
  error?: string | undefined;
  /** A short help line under the label. */
  hint?: string | undefined;
  /** Renders the control with the ids and ARIA attributes given. */
  children: (control: FieldControlProps) => ReactNode;
}) {
  const id = useId();
  const describedBy = [hint ? `${id}-hint` : '', error ? `${id}-error` : ''].filter(Boolean).join(' ');
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="font-medium">
        {label}
      </label>
      {hint ? (
        <p id={`${id}-hint`} className="text-sm text-abyss-soft">
          {hint}
        </p>
      ) : null}
      {children({ id, 'aria-invalid': error ? true : undefined, 'aria-describedby': describedBy || undefined })}
      {error ? (
        <p id={`${id}-error`} className="text-sm text-[#9c211a]">
          {error}
        </p>
      ) : null}
    </div>
  );
}
