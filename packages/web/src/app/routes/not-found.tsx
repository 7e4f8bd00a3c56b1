import { Link, useLocation } from 'react-router-dom';
import { buttonStyles } from '../../components/ui/button-styles';

/** Shown for any address the site does not know: says which, and offers the way back. */
export function NotFoundPage() {
  const { pathname } = useLocation();
  return (
    <div className="mx-auto max-w-xl px-6 py-24 text-center">
      <p className="text-sm font-semibold tracking-wide text-abyss-soft uppercase">Error 404</p>
      <h1 className="mt-1 text-2xl font-semibold">Nothing here</h1>
      <p className="mt-2 text-abyss-soft">
        This address does not lead to a page of Leadline: <code className="break-all">{pathname}</code>. A link may be
        mistyped, or the page may have moved.
      </p>
      <div className="mt-6 flex flex-wrap justify-center gap-3">
        <Link to="/" className={buttonStyles('primary', 'min-h-10')}>
          Back to the start
        </Link>
        <Link to="/sign-in" className={buttonStyles('secondary', 'min-h-10')}>
          Sign in
        </Link>
      </div>
    </div>
  );
}
