import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';

export const subscriptionsSchema = z.object({ products: z.array(z.string()) });

export const subscriptionsQueryKey = ['signals', 'subscriptions'] as const;

/** The products whose new signals are mailed to the signed-in engineer. */
export const subscriptionsQueryOptions = () =>
  queryOptions({
    queryKey: subscriptionsQueryKey,
    queryFn: ({ signal }) => apiClient.get('/api/v1/signals/subscriptions', { schema: subscriptionsSchema, signal }),
  });

export function useSubscriptions(enabled: boolean) {
  return useQuery({ ...subscriptionsQueryOptions(), enabled });
}
