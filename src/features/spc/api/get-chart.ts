import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { chartSchema } from './spc-schemas';

export const chartQueryKey = (id: number) => ['spc', 'chart', id] as const;

export const chartQueryOptions = (id: number) =>
  queryOptions({
    queryKey: chartQueryKey(id),
    queryFn: ({ signal }) => apiClient.get(`/api/v1/spc/characteristics/${id}/chart`, { schema: chartSchema, signal }),
  });

export function useChart(id: number | null) {
  return useQuery({ ...chartQueryOptions(id ?? 0), enabled: id !== null });
}
