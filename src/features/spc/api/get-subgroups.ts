import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { subgroupsSchema } from './spc-schemas';

export const subgroupsQueryOptions = (id: number) =>
  queryOptions({
    queryKey: ['spc', 'subgroups', id] as const,
    queryFn: ({ signal }) => apiClient.get(`/api/v1/spc/characteristics/${id}/subgroups`, { schema: subgroupsSchema, signal }),
  });

export function useSubgroups(id: number) {
  return useQuery(subgroupsQueryOptions(id));
}
