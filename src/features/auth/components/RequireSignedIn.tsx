import { Navigate, Outlet, useLocation } from 'react-router-dom';
import { ErrorNote } from '../../../components/ErrorNote';
import { LoadingScreen } from '../../../components/Spinner';
import { isApiError } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { useMe } from '../api/get-me';

/** Layout route: renders its children only for a signed-in user; a 401 from /api/me goes to sign-in. */
export function RequireSignedIn() {
  const me = useMe();
  const location = useLocation();

  if (me.isPending) return <LoadingScreen label="Checking your session…" />;

  if (isApiError(me.error) && me.error.isUnauthenticated) {
    return <Navigate to={paths.signIn.href(location.pathname + location.search)} replace />;
  }

  if (me.isError && !me.data) {
    return (
      <div className="mx-auto max-w-xl p-8">
        <ErrorNote error={me.error} title="Could not check your session" />
      </div>
    );
  }

  return <Outlet />;
}
