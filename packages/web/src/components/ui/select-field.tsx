import { type ReactNode, type Ref, type SelectHTMLAttributes, useId } from 'react';
import { fieldStyles } from './field-styles';

interface SelectFieldProps extends Omit<SelectHTMLAttributes<HTMLSelectElement>, 'id'> {
  label: string;
  error?: string | undefined;
  hint?: string | undefined;
  children: ReactNode;
  ref?: Ref<HTMLSelectElement>;
}

/** A labelled select with its help line and inline error tied to it. */
export function SelectField({ label, error, hint, className, children, ref, ...select }: SelectFieldProps) {
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
      <select
        id={id}
        ref={ref}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy || undefined}
        className={fieldStyles(Boolean(error), className)}
        {...select}
      >
        {children}
      </select>
      {error ? (
        <p id={`${id}-error`} className="text-sm text-[#9c211a]">
          {error}
        </p>
      ) : null}
    </div>
  );
}
