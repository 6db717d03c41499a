import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { signalDetailSchema } from './signal-schemas';

export const signalQueryKey = (id: string) => ['signals', 'detail', id] as const;

export const signalQueryOptions = (id: string) =>
  queryOptions({
    queryKey: signalQueryKey(id),
    queryFn: ({ signal }) => apiClient.get(`/api/v1/signals/${encodeURIComponent(id)}`, { schema: signalDetailSchema, signal }),
  });

export function useSignal(id: string) {
  return useQuery(signalQueryOptions(id));
}
