import { zodResolver } from '@hookform/resolvers/zod';
import { useId } from 'react';
import { useForm } from 'react-hook-form';
import { buttonStyles } from '../../../components/ui/button-styles';
import { FormFailure } from '../../../components/ui/form-failure';
import { SelectField } from '../../../components/ui/select-field';
import { TextField } from '../../../components/ui/text-field';
import { type CreatedToken, useCreateToken } from '../api/create-token';
import { type CreateTokenValues, createTokenSchema, toExpiresInDays } from '../token-schema';

const EXPIRY_LABELS: Record<CreateTokenValues['expiry'], string> = {
  '7': 'In 7 days',
  '30': 'In 30 days',
  '90': 'In 90 days',
  '365': 'In a year',
  never: 'Never (revoke it by hand)',
};

/** Name, scope and expiry of a new token; a viewer may create read tokens only. */
export function CreateTokenForm({
  organisationId,
  canWrite,
  onCreated,
}: {
  organisationId: string;
  canWrite: boolean;
  onCreated: (created: CreatedToken) => void;
}) {
  const id = useId();
  const create = useCreateToken();
  const {
    register,
    handleSubmit,
    reset,
    formState: { errors, isSubmitting },
  } = useForm<CreateTokenValues>({
    resolver: zodResolver(createTokenSchema),
    mode: 'onTouched',
    defaultValues: { name: '', scope: 'read', expiry: '90' },
  });
  const onSubmit = handleSubmit(async (values) => {
    try {
      const created = await create.mutateAsync({
        organisationId,
        name: values.name,
        scope: canWrite ? values.scope : 'read',
        expiresInDays: toExpiresInDays(values.expiry),
      });
      reset();
      onCreated(created);
    } catch {
      // Shown by FormFailure.
    }
  });
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4" aria-labelledby={`${id}-title`}>
      <h2 id={`${id}-title`} className="text-lg font-semibold">
        Create a token
      </h2>
      <TextField
        label="Name"
        hint="Say what will use it, e.g. “GIS nightly import”."
        maxLength={100}
        error={errors.name?.message}
        {...register('name')}
      />
      <fieldset className="flex flex-col gap-1" aria-describedby={canWrite ? undefined : `${id}-scope-note`}>
        <legend className="mb-1 font-medium">Scope</legend>
        <label className="flex min-h-9 items-center gap-2">
          <input type="radio" value="read" className="size-4 accent-kelp" {...register('scope')} />
          Read: fetch projects, dives and tracks
        </label>
        <label className={`flex min-h-9 items-center gap-2 ${canWrite ? '' : 'text-abyss-soft'}`}>
          <input
            type="radio"
            value="read-write"
            className="size-4 accent-kelp"
            disabled={!canWrite}
            {...register('scope')}
          />
          Read and write: also upload logs and change things, with your role&rsquo;s rights
        </label>
        {canWrite ? null : (
          <p id={`${id}-scope-note`} className="text-sm text-abyss-soft">
            As a viewer in this organisation you can create read tokens only.
          </p>
        )}
        {errors.scope ? <p className="text-sm text-[#9c211a]">{errors.scope.message}</p> : null}
      </fieldset>
      <SelectField label="Expires" error={errors.expiry?.message} {...register('expiry')}>
        {Object.entries(EXPIRY_LABELS).map(([value, label]) => (
          <option key={value} value={value}>
            {label}
          </option>
        ))}
      </SelectField>
      <FormFailure error={create.error} />
      <div>
        <button type="submit" className={buttonStyles('primary', 'min-h-10')} disabled={isSubmitting}>
          {isSubmitting ? 'Creating…' : 'Create the token'}
        </button>
      </div>
    </form>
  );
}
