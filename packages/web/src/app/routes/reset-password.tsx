import { Link, useSearchParams } from 'react-router-dom';
import { ResetPasswordForm } from '../../features/auth/components/reset-password-form';

/** Where the e-mailed reset link leads (`/reset-password?token=…`, see the server's password-reset service). */
export function ResetPasswordPage() {
  const [params] = useSearchParams();
  const token = params.get('token');
  return (
    <div className="mx-auto flex max-w-sm flex-col gap-6 py-10">
      <div>
        <h1 className="text-2xl font-semibold">Choose a new password</h1>
        <p className="mt-1 text-abyss-soft">The link works once, for one hour after it was sent.</p>
      </div>
      {token ? (
        <ResetPasswordForm token={token} />
      ) : (
        <div role="alert" className="rounded-lg border border-[#9c211a]/30 bg-[#fbe4e2] p-5 text-[#7d1a14]">
          <p>This address has no reset token. Open the link from the e-mail in full, or ask for a new one.</p>
          <Link to="/forgot-password" className="mt-2 inline-block font-medium underline underline-offset-2">
            Ask for a reset link
          </Link>
        </div>
      )}
    </div>
  );
}
