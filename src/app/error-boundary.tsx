import { Component, type ErrorInfo, type ReactNode } from 'react';
import { isRouteErrorResponse, useRouteError } from 'react-router-dom';
import { isApiError } from '../lib/api-client';
import { NotFoundRoute } from '../routes/not-found';
import { ErrorScreen } from './error-screen';

type Described = { code: string; message?: string };

function describe(error: unknown): Described {
  if (isApiError(error)) return { code: error.code, message: error.message };
  if (error instanceof TypeError && /dynamically imported module|Importing a module script/i.test(error.message)) {
    return { code: 'stale_client', message: 'A newer version of Fluxtrail is available. Reload the page to load it.' };
  }
  return { code: 'client_error' };
}

/** `errorElement` for routes: loader, lazy-load and render errors inside the shell. */
export function RouteErrorBoundary() {
  const error = useRouteError();
  if (isRouteErrorResponse(error) && error.status === 404) return <NotFoundRoute />;
  if (isRouteErrorResponse(error)) return <ErrorScreen code={`http_${error.status}`} />;
  return <ErrorScreen {...describe(error)} />;
}

type AppErrorBoundaryState = { error: unknown };

/** Last line of defence around the whole app, for errors outside the router. */
export class AppErrorBoundary extends Component<{ children: ReactNode }, AppErrorBoundaryState> {
  override state: AppErrorBoundaryState = { error: undefined };

  static getDerivedStateFromError(error: unknown): AppErrorBoundaryState {
    return { error };
  }

  override componentDidCatch(error: unknown, info: ErrorInfo): void {
    console.error('Fluxtrail client error', error, info.componentStack);
  }

  override render(): ReactNode {
    if (this.state.error === undefined) return this.props.children;
    return <ErrorScreen {...describe(this.state.error)} />;
  }
}
