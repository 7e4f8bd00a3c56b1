import { Navigate, Outlet, useLocation } from 'react-router-dom';
import { ErrorState, LoadingState } from '../../components/ui/query-states';
import { useMe } from '../../features/auth/api/get-me';

/** The signed-in part of the site: sends anyone not signed in to the sign-in page, and back afterwards. */
export function RequireSignIn() {
  const me = useMe();
  const location = useLocation();
  if (me.isPending) return <LoadingState label="Checking sign-in…" />;
  if (me.isError)
    return (
      <ErrorState title="Could not check whether you are signed in" error={me.error} onRetry={() => me.refetch()} />
    );
  if (me.data === null) {
    const next = `${location.pathname}${location.search}`;
    return <Navigate to={`/sign-in?next=${encodeURIComponent(next)}`} replace />;
  }
  return <Outlet />;
}
