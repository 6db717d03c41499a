import { Suspense } from 'react';
import { Outlet, useNavigation } from 'react-router-dom';
import { LoadingScreen } from '../../components/Spinner';
import { useMe } from '../../features/auth/api/get-me';
import { NavMenu } from './NavMenu';
import { TopBar } from './TopBar';

/** Signed-in frame: top bar, navigation and the off-white content surface. Rendered under RequireSignedIn. */
export function AppShell() {
  const { data: me } = useMe();
  const navigation = useNavigation();
  if (!me) return null;

  return (
    <div className="flex min-h-screen flex-col">
      <TopBar me={me} />
      <div aria-hidden="true" className={`h-0.5 ${navigation.state === 'loading' ? 'animate-pulse bg-copper-500' : 'bg-graphite-950'}`} />
      <div className="flex flex-1 flex-col lg:flex-row">
        <NavMenu permissions={me.permissions} />
        <main className="min-w-0 flex-1 bg-paper-100 px-4 py-6 lg:px-8" aria-busy={navigation.state === 'loading'}>
          <Suspense fallback={<LoadingScreen />}>
            <Outlet />
          </Suspense>
        </main>
      </div>
    </div>
  );
}
