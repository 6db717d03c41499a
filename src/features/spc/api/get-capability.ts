import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { windowSearch, type ChartWindow } from './chart-window';
import { capabilitySchema } from './spc-schemas';

export const capabilityQueryOptions = (id: number, window: ChartWindow = {}) =>
  queryOptions({
    queryKey: ['spc', 'capability', id, window] as const,
    queryFn: ({ signal }) => apiClient.get(`/api/v1/spc/characteristics/${id}/capability${windowSearch(window)}`, { schema: capabilitySchema, signal }),
  });

export function useCapability(id: number, window: ChartWindow = {}) {
  return useQuery(capabilityQueryOptions(id, window));
}
