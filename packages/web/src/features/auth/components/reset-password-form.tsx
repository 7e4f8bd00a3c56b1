import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { Link } from 'react-router-dom';
import { buttonStyles } from '../../../components/ui/button-styles';
import { FormFailure } from '../../../components/ui/form-failure';
import { TextField } from '../../../components/ui/text-field';
import { ApiError } from '../../../lib/api-client';
import { PASSWORD_MIN_LENGTH, type ResetPasswordValues, resetPasswordSchema } from '../account-schemas';
import { useCompletePasswordReset } from '../api/complete-password-reset';

/** A new password, typed twice, set with the token of a reset link. */
export function ResetPasswordForm({ token }: { token: string }) {
  const complete = useCompletePasswordReset();
  const {
    register,
    handleSubmit,
    formState: { errors, isSubmitting },
  } = useForm<ResetPasswordValues>({ resolver: zodResolver(resetPasswordSchema), mode: 'onTouched' });
  const onSubmit = handleSubmit(async (values) => {
    try {
      await complete.mutateAsync({ token, password: values.password });
    } catch {
      // Shown by FormFailure.
    }
  });
  if (complete.isSuccess)
    return (
      <div role="status" className="flex flex-col items-start gap-3 rounded-lg border border-kelp/40 bg-white p-5">
        <h2 className="font-semibold">Password changed</h2>
        <p className="text-abyss-soft">
          Every session of this account has been signed out. Sign in with the new password.
        </p>
        <Link to="/sign-in" className={buttonStyles('primary', 'min-h-10')}>
          Sign in
        </Link>
      </div>
    );
  const linkGone = complete.error instanceof ApiError && complete.error.status === 404;
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      <TextField
        label="New password"
        type="password"
        autoComplete="new-password"
        hint={`At least ${PASSWORD_MIN_LENGTH} characters; a few words in a row are fine.`}
        error={errors.password?.message}
        {...register('password')}
      />
      <TextField
        label="New password again"
        type="password"
        autoComplete="new-password"
        error={errors.confirmPassword?.message}
        {...register('confirmPassword')}
      />
      <FormFailure error={complete.error} />
      {linkGone ? (
        <p className="text-sm">
          <Link to="/forgot-password" className="font-medium text-abyss-soft underline underline-offset-2">
            Ask for a new reset link
          </Link>
        </p>
      ) : null}
      <button type="submit" className={buttonStyles('primary', 'min-h-10')} disabled={isSubmitting}>
        {isSubmitting ? 'Saving…' : 'Set the new password'}
      </button>
    </form>
  );
}
