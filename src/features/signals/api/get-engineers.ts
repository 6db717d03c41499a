import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';

const engineersSchema = z.object({ engineers: z.array(z.object({ subject: z.string(), name: z.string() })) });

export const engineersQueryOptions = () =>
  queryOptions({
    queryKey: ['signals', 'engineers'] as const,
    queryFn: ({ signal }) => apiClient.get('/api/v1/signals/engineers', { schema: engineersSchema, signal }),
  });

export function useEngineers() {
  return useQuery(engineersQueryOptions());
}
