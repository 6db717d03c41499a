import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient, isApiError } from '../../../lib/api-client';
import { roles } from '../../../lib/permissions';

const meSchema = z.object({
  user: z.object({ name: z.string(), email: z.string() }),
  role: z.enum(roles),
  // Names are the server's; the client only asks "is this one in the list?" (see useCan).
  permissions: z.array(z.string()),
});

export type Me = z.infer<typeof meSchema>;

export const meQueryKey = ['me'] as const;

export function getMe(signal?: AbortSignal): Promise<Me> {
  return apiClient.get('/api/me', { schema: meSchema, signal });
}

export const meQueryOptions = () =>
  queryOptions({
    queryKey: meQueryKey,
    queryFn: ({ signal }) => getMe(signal),
    staleTime: 5 * 60_000,
    // A 401 is an answer ("not signed in"), not a failure worth retrying.
    retry: (failureCount, error) => !(isApiError(error) && error.status < 500) && failureCount < 2,
    retryOnMount: false,
  });

export function useMe() {
  return useQuery(meQueryOptions());
}
