import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { windowSearch, type ChartWindow } from './chart-window';
import { subgroupsSchema } from './spc-schemas';

export const subgroupsQueryOptions = (id: number, window: ChartWindow = {}) =>
  queryOptions({
    queryKey: ['spc', 'subgroups', id, window] as const,
    queryFn: ({ signal }) => apiClient.get(`/api/v1/spc/characteristics/${id}/subgroups${windowSearch(window)}`, { schema: subgroupsSchema, signal }),
  });

export function useSubgroups(id: number, window: ChartWindow = {}) {
  return useQuery(subgroupsQueryOptions(id, window));
}
