import type { InputHTMLAttributes, Ref } from 'react';
import { fieldStyles } from './field-styles';
import { LabelledField } from './labelled-field';

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
  return (
    <LabelledField label={label} error={error} hint={hint}>
      {(control) => <input {...control} ref={ref} className={fieldStyles(Boolean(error), className)} {...input} />}
    </LabelledField>
  );
}
