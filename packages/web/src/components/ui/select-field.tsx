import type { ReactNode, Ref, SelectHTMLAttributes } from 'react';
import { fieldStyles } from './field-styles';
import { LabelledField } from './labelled-field';

interface SelectFieldProps extends Omit<SelectHTMLAttributes<HTMLSelectElement>, 'id'> {
  label: string;
  error?: string | undefined;
  hint?: string | undefined;
  children: ReactNode;
  ref?: Ref<HTMLSelectElement>;
}

/** A labelled select with its help line and inline error tied to it. */
export function SelectField({ label, error, hint, className, children, ref, ...select }: SelectFieldProps) {
  return (
    <LabelledField label={label} error={error} hint={hint}>
      {(control) => (
        <select {...control} ref={ref} className={fieldStyles(Boolean(error), className)} {...select}>
          {children}
        </select>
      )}
    </LabelledField>
  );
}
