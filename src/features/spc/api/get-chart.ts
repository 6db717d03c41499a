import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { windowSearch, type ChartWindow } from './chart-window';
import { chartSchema } from './spc-schemas';

/** The prefix shared by every window of one characteristic's chart, for invalidation. */
export const chartQueryKey = (id: number) => ['spc', 'chart', id] as const;

export const chartQueryOptions = (id: number, window: ChartWindow = {}) =>
  queryOptions({
    queryKey: [...chartQueryKey(id), window] as const,
    queryFn: ({ signal }) => apiClient.get(`/api/v1/spc/characteristics/${id}/chart${windowSearch(window)}`, { schema: chartSchema, signal }),
  });

export function useChart(id: number | null, window: ChartWindow = {}) {
  return useQuery({ ...chartQueryOptions(id ?? 0, window), enabled: id !== null });
}
