import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { subscriptionsQueryKey, subscriptionsSchema } from './get-subscriptions';

export type SubscriptionChange = { product: string; subscribed: boolean };

export function setSubscription({ product, subscribed }: SubscriptionChange) {
  const path = `/api/v1/signals/subscriptions/${encodeURIComponent(product)}`;
  return subscribed
    ? apiClient.put(path, { schema: subscriptionsSchema, body: {} })
    : apiClient.delete(path, { schema: subscriptionsSchema });
}

export function useSetSubscription() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: setSubscription,
    // The answer is the new list, so the toggle shows it without another round trip.
    onSuccess: (answer) => queryClient.setQueryData(subscriptionsQueryKey, answer),
  });
}
