import { Link } from 'react-router-dom';
import { ForgotPasswordForm } from '../../features/auth/components/forgot-password-form';

/** Asks for a password-reset link by e-mail. */
export function ForgotPasswordPage() {
  return (
    <div className="mx-auto flex max-w-sm flex-col gap-6 py-10">
      <div>
        <h1 className="text-2xl font-semibold">Forgot your password?</h1>
        <p className="mt-1 text-abyss-soft">
          Give the e-mail address you sign in with; we send a link to choose a new one.
        </p>
      </div>
      <ForgotPasswordForm />
      <p className="text-sm">
        <Link to="/sign-in" className="font-medium text-abyss-soft underline underline-offset-2">
          Back to sign in
        </Link>
      </p>
    </div>
  );
}
