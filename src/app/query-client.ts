import { QueryCache, QueryClient } from '@tanstack/react-query';
import { meQueryKey } from '../features/auth/api/get-me';
import { isApiError } from '../lib/api-client';

/**
 * When any request answers 401 the session has ended; re-asking /api/me lets the session guard
 * send the user to sign-in, instead of each screen handling it on its own.
 */
export function createQueryClient(): QueryClient {
  const queryClient: QueryClient = new QueryClient({
    queryCache: new QueryCache({
      onError: (error, query) => {
        if (isApiError(error) && error.isUnauthenticated && query.queryKey[0] !== meQueryKey[0]) {
          void queryClient.invalidateQueries({ queryKey: meQueryKey });
        }
      },
    }),
    defaultOptions: {
      queries: {
        staleTime: 30_000,
        refetchOnWindowFocus: false,
        retry: (failureCount, error) => !(isApiError(error) && error.status < 500) && failureCount < 2,
      },
    },
  });
  return queryClient;
}
