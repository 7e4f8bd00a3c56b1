import { type InputHTMLAttributes, type Ref, useId } from 'react';
import { fieldStyles } from './field-styles';

interface TextFieldProps extends Omit<InputHTMLAttributes<HTMLInputElement>, 'id'> {
  label: string;
  /** The field's validation message, shown under it and announced with it. */
  error?: string | undefined;
  /** A short help line under the label. */
  hint?: string | undefined;
  ref?: Ref<HTMLInputElement>;
}

/** A labelled input with its help line and inline error tied to it (`aria-describedby`). */
export function TextField({ label, error, hint, className, ref, ...input }: TextFieldProps) {
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
      <input
        id={id}
        ref={ref}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy || undefined}
        className={fieldStyles(Boolean(error), className)}
        {...input}
      />
      {error ? (
        <p id={`${id}-error`} className="text-sm text-[#9c211a]">
          {error}
        </p>
      ) : null}
    </div>
  );
}
