import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { buttonStyles } from '../../../components/ui/button-styles';
import { FormFailure } from '../../../components/ui/form-failure';
import { TextField } from '../../../components/ui/text-field';
import { type ForgotPasswordValues, forgotPasswordSchema } from '../account-schemas';
import { useRequestPasswordReset } from '../api/request-password-reset';

/** Asks for a reset link; afterwards says the same thing whether or not the address has an account. */
export function ForgotPasswordForm() {
  const request = useRequestPasswordReset();
  const {
    register,
    handleSubmit,
    getValues,
    formState: { errors, isSubmitting },
  } = useForm<ForgotPasswordValues>({ resolver: zodResolver(forgotPasswordSchema), mode: 'onTouched' });
  const onSubmit = handleSubmit(async (values) => {
    try {
      await request.mutateAsync(values);
    } catch {
      // Shown by FormFailure.
    }
  });
  if (request.isSuccess)
    return (
      <div role="status" className="rounded-lg border border-kelp/40 bg-white p-5">
        <h2 className="font-semibold">Check your mail</h2>
        <p className="mt-1 text-abyss-soft">
          If an account uses {getValues('email')}, a link to choose a new password is on its way. The link works once,
          for one hour.
        </p>
      </div>
    );
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      <TextField
        label="E-mail address"
        type="email"
        autoComplete="username"
        error={errors.email?.message}
        {...register('email')}
      />
      <FormFailure error={request.error} />
      <button type="submit" className={buttonStyles('primary', 'min-h-10')} disabled={isSubmitting}>
        {isSubmitting ? 'Sending…' : 'Send me a reset link'}
      </button>
    </form>
  );
}
