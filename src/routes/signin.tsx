import { Navigate, useSearchParams } from 'react-router-dom';
import { ButtonLink } from '../components/Button';
import { useMe } from '../features/auth/api/get-me';
import { AuthPanel } from '../features/auth/components/AuthPanel';
import { authPaths, safeReturnTo } from '../lib/paths';

export function SignInRoute() {
  const [searchParams] = useSearchParams();
  const returnTo = safeReturnTo(searchParams.get('returnTo'));
  const { data: me } = useMe();

  // Someone already signed in (e.g. a bookmarked /signin) goes straight on.
  if (me) return <Navigate to={returnTo} replace />;

  return (
    <AuthPanel>
      <p className="mt-3 text-base text-graphite-700">End-of-line test records and traceability</p>
      <ButtonLink href={authPaths.login(returnTo)} size="glove" className="mt-8 w-full">
        Sign in
      </ButtonLink>
      <p className="mt-4 text-sm text-graphite-500">You sign in with your plant account.</p>
    </AuthPanel>
  );
}
