import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { signalListSchema, type SignalStatus } from './signal-schemas';

export type SignalFilter = { status?: SignalStatus; product?: string; characteristicId?: number };

export const signalsQueryKey = ['signals', 'list'] as const;

export const signalsQueryOptions = (filter: SignalFilter) =>
  queryOptions({
    queryKey: [...signalsQueryKey, filter] as const,
    queryFn: ({ signal }) => apiClient.get('/api/v1/signals', { schema: signalListSchema, params: filter, signal }),
  });

export function useSignals(filter: SignalFilter) {
  return useQuery(signalsQueryOptions(filter));
}
