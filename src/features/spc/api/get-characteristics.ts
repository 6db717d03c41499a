import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { characteristicListSchema } from './spc-schemas';

export const spcCharacteristicsQueryKey = ['spc', 'characteristics'] as const;

export const spcCharacteristicsQueryOptions = () =>
  queryOptions({
    queryKey: spcCharacteristicsQueryKey,
    queryFn: ({ signal }) => apiClient.get('/api/v1/spc/characteristics', { schema: characteristicListSchema, signal }),
  });

export function useSpcCharacteristics() {
  return useQuery(spcCharacteristicsQueryOptions());
}
