import { zodResolver } from '@hookform/resolvers/zod';
import { useId } from 'react';
import { useForm } from 'react-hook-form';
import { buttonStyles } from '../../../components/ui/button-styles';
import { ApiError } from '../../../lib/api-client';
import type { CurrentUser } from '../api/get-me';
import { useSignIn } from '../api/sign-in';
import { type SignInValues, signInSchema } from '../sign-in-schema';

/** Why signing in failed, in words for the person at the form. */
function describeFailure(error: unknown): string {
  if (error instanceof ApiError) {
    if (error.status === 401) return error.message || 'The e-mail address or the password is wrong.';
    if (error.status === 429) return 'Too many attempts. Wait a minute, then try again.';
    return error.message;
  }
  return 'The server could not be reached. Check the connection and try again.';
}

const INPUT =
  'min-h-10 w-full rounded-md border bg-white px-3 text-base focus-visible:outline-3 focus-visible:outline-offset-1 focus-visible:outline-kelp';

/** E-mail and password, checked as you leave a field and again on submit. */
export function SignInForm({ onSignedIn }: { onSignedIn: (user: CurrentUser) => void }) {
  const id = useId();
  const signIn = useSignIn();
  const {
    register,
    handleSubmit,
    formState: { errors, isSubmitting },
  } = useForm<SignInValues>({ resolver: zodResolver(signInSchema), mode: 'onTouched' });
  const onSubmit = handleSubmit(async (values) => {
    try {
      onSignedIn(await signIn.mutateAsync(values));
    } catch {
      // The mutation's error is shown below the fields.
    }
  });
  const emailError = errors.email?.message;
  const passwordError = errors.password?.message;
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4" aria-describedby={`${id}-failure`}>
      <div className="flex flex-col gap-1">
        <label htmlFor={`${id}-email`} className="font-medium">
          E-mail address
        </label>
        <input
          id={`${id}-email`}
          type="email"
          autoComplete="username"
          aria-invalid={emailError ? true : undefined}
          aria-describedby={emailError ? `${id}-email-error` : undefined}
          className={`${INPUT} ${emailError ? 'border-[#9c211a]' : 'border-abyss/30'}`}
          {...register('email')}
        />
        {emailError ? (
          <p id={`${id}-email-error`} className="text-sm text-[#9c211a]">
            {emailError}
          </p>
        ) : null}
      </div>
      <div className="flex flex-col gap-1">
        <label htmlFor={`${id}-password`} className="font-medium">
          Password
        </label>
        <input
          id={`${id}-password`}
          type="password"
          autoComplete="current-password"
          aria-invalid={passwordError ? true : undefined}
          aria-describedby={passwordError ? `${id}-password-error` : undefined}
          className={`${INPUT} ${passwordError ? 'border-[#9c211a]' : 'border-abyss/30'}`}
          {...register('password')}
        />
        {passwordError ? (
          <p id={`${id}-password-error`} className="text-sm text-[#9c211a]">
            {passwordError}
          </p>
        ) : null}
      </div>
      <div id={`${id}-failure`} role="alert" className="text-sm text-[#9c211a] empty:hidden">
        {signIn.isError ? describeFailure(signIn.error) : ''}
      </div>
      <button type="submit" className={buttonStyles('primary', 'min-h-10')} disabled={isSubmitting}>
        {isSubmitting ? 'Signing in…' : 'Sign in'}
      </button>
    </form>
  );
}
