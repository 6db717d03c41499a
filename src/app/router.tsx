import { createBrowserRouter, type RouteObject } from 'react-router-dom';
import { LoadingScreen } from '../components/Spinner';
import { RequirePermission } from '../features/auth/components/RequirePermission';
import { RequireSignedIn } from '../features/auth/components/RequireSignedIn';
import { paths } from '../lib/paths';
import { NotFoundRoute } from '../routes/not-found';
import { SignInRoute } from '../routes/signin';
import { SignedOutRoute } from '../routes/signed-out';
import { RouteErrorBoundary } from './error-boundary';
import { HomeRedirect } from './home-redirect';
import { AppShell } from './layout/AppShell';
import { screens, type Screen } from './screens';

/** Each screen: a permission guard around its lazily loaded route module. */
function screenRoute(screen: Screen): RouteObject {
  return {
    path: screen.path,
    element: <RequirePermission action={screen.action} />,
    children: [{ index: true, lazy: async () => ({ Component: (await screen.load()).default }) }],
  };
}

export const router = createBrowserRouter([
  {
    errorElement: <RouteErrorBoundary />,
    hydrateFallbackElement: <LoadingScreen />,
    children: [
      { path: paths.signIn.path, element: <SignInRoute /> },
      { path: paths.signedOut.path, element: <SignedOutRoute /> },
      {
        element: <RequireSignedIn />,
        children: [
          {
            element: <AppShell />,
            children: [
              {
                errorElement: <RouteErrorBoundary />,
                children: [
                  { index: true, element: <HomeRedirect /> },
                  ...Object.values(screens).map(screenRoute),
                  { path: '*', element: <NotFoundRoute /> },
                ],
              },
            ],
          },
        ],
      },
    ],
  },
]);
