import { zodResolver } from '@hookform/resolvers/zod';
import { useId, useState } from 'react';
import { useForm } from 'react-hook-form';
import { buttonStyles } from '../../../components/ui/button-styles';
import { FormFailure } from '../../../components/ui/form-failure';
import { TextField } from '../../../components/ui/text-field';
import { ApiError } from '../../../lib/api-client';
import { type NewAccountValues, newAccountSchema, PASSWORD_MIN_LENGTH } from '../account-schemas';
import { type AcceptedInvitation, useAcceptInvitation } from '../api/accept-invitation';

type Mode = 'new' | 'existing';

function NewAccountFields({ token, onAccepted }: { token: string; onAccepted: (joined: AcceptedInvitation) => void }) {
  const accept = useAcceptInvitation();
  const {
    register,
    handleSubmit,
    formState: { errors, isSubmitting },
  } = useForm<NewAccountValues>({ resolver: zodResolver(newAccountSchema), mode: 'onTouched' });
  const onSubmit = handleSubmit(async (values) => {
    try {
      onAccepted(await accept.mutateAsync({ token, displayName: values.displayName, password: values.password }));
    } catch {
      // Shown by FormFailure.
    }
  });
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      <TextField
        label="Your name"
        autoComplete="name"
        hint="As colleagues will see it."
        error={errors.displayName?.message}
        {...register('displayName')}
      />
      <TextField
        label="Password"
        type="password"
        autoComplete="new-password"
        hint={`At least ${PASSWORD_MIN_LENGTH} characters; a few words in a row are fine.`}
        error={errors.password?.message}
        {...register('password')}
      />
      <TextField
        label="Password again"
        type="password"
        autoComplete="new-password"
        error={errors.confirmPassword?.message}
        {...register('confirmPassword')}
      />
      <FormFailure error={accept.error} />
      <button type="submit" className={buttonStyles('primary', 'min-h-10')} disabled={isSubmitting}>
        {isSubmitting ? 'Joining…' : 'Create the account and join'}
      </button>
    </form>
  );
}

function ExistingAccount({
  token,
  onAccepted,
  onNeedsAccount,
}: {
  token: string;
  onAccepted: (joined: AcceptedInvitation) => void;
  onNeedsAccount: () => void;
}) {
  const accept = useAcceptInvitation();
  const needsAccount = accept.error instanceof ApiError && accept.error.status === 422;
  return (
    <div className="flex flex-col gap-4">
      <p className="text-abyss-soft">
        The organisation is added to the account of the invited address, and this browser is signed in to it.
      </p>
      {needsAccount ? (
        <div role="alert" className="flex flex-col items-start gap-2 text-sm text-[#9c211a]">
          <p>The invited address has no Leadline account yet.</p>
          <button type="button" className={buttonStyles('secondary')} onClick={onNeedsAccount}>
            Create an account instead
          </button>
        </div>
      ) : (
        <FormFailure error={accept.error} />
      )}
      <button
        type="button"
        className={buttonStyles('primary', 'min-h-10')}
        disabled={accept.isPending}
        onClick={() => accept.mutate({ token }, { onSuccess: onAccepted })}
      >
        {accept.isPending ? 'Joining…' : 'Join with my account'}
      </button>
    </div>
  );
}

/** Accepts an invitation, either creating an account (name and password) or joining with an existing one. */
export function AcceptInvitationForm({
  token,
  onAccepted,
}: {
  token: string;
  onAccepted: (joined: AcceptedInvitation) => void;
}) {
  const id = useId();
  const [mode, setMode] = useState<Mode>('new');
  const choices: { value: Mode; label: string }[] = [
    { value: 'new', label: 'I am new to Leadline' },
    { value: 'existing', label: 'I already have a Leadline account' },
  ];
  return (
    <div className="flex flex-col gap-6">
      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1 font-medium">Your account</legend>
        {choices.map((choice) => (
          <label key={choice.value} className="flex min-h-9 items-center gap-2">
            <input
              type="radio"
              name={`${id}-mode`}
              value={choice.value}
              checked={mode === choice.value}
              onChange={() => setMode(choice.value)}
              className="size-4 accent-kelp focus-visible:outline-3 focus-visible:outline-offset-2 focus-visible:outline-kelp"
            />
            {choice.label}
          </label>
        ))}
      </fieldset>
      {mode === 'new' ? (
        <NewAccountFields token={token} onAccepted={onAccepted} />
      ) : (
        <ExistingAccount token={token} onAccepted={onAccepted} onNeedsAccount={() => setMode('new')} />
      )}
    </div>
  );
}
