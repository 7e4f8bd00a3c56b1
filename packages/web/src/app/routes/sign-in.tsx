import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { SignInForm } from '../../features/auth/components/sign-in-form';

/** Only same-site paths are followed after signing in. */
function safeNext(next: string | null): string {
  return next?.startsWith('/') && !next.startsWith('//') ? next : '/';
}

/** The sign-in page. */
export function SignInPage() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  return (
    <div className="mx-auto flex max-w-sm flex-col gap-6 py-10">
      <div>
        <h1 className="text-2xl font-semibold">Sign in</h1>
        <p className="mt-1 text-abyss-soft">Use the e-mail address your invitation was sent to.</p>
      </div>
      <SignInForm onSignedIn={() => navigate(safeNext(params.get('next')), { replace: true })} />
      <p className="text-sm">
        <Link to="/forgot-password" className="font-medium text-abyss-soft underline underline-offset-2">
          Forgot password?
        </Link>
      </p>
    </div>
  );
}
