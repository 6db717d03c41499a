import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { capabilitySchema } from './spc-schemas';

export const capabilityQueryOptions = (id: number) =>
  queryOptions({
    queryKey: ['spc', 'capability', id] as const,
    queryFn: ({ signal }) => apiClient.get(`/api/v1/spc/characteristics/${id}/capability`, { schema: capabilitySchema, signal }),
  });

export function useCapability(id: number) {
  return useQuery(capabilityQueryOptions(id));
}
