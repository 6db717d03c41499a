import { ButtonLink } from '../components/Button';
import { AuthPanel } from '../features/auth/components/AuthPanel';
import { authPaths, paths } from '../lib/paths';

export function SignedOutRoute() {
  return (
    <AuthPanel>
      <h1 className="mt-6 text-xl font-semibold text-graphite-900">You are signed out</h1>
      <p className="mt-2 text-sm text-graphite-600">Close this tab on a shared station, or sign in again to carry on.</p>
      <ButtonLink href={authPaths.login(paths.home.href())} size="glove" variant="secondary" className="mt-8 w-full">
        Sign in again
      </ButtonLink>
    </AuthPanel>
  );
}
