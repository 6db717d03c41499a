import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { setupApiBase, stationClientSchema } from './setup-schemas';

const responseSchema = z.object({ stationClients: z.array(stationClientSchema) }).transform((body) => body.stationClients);

export const stationClientsQueryOptions = () =>
  queryOptions({
    queryKey: ['setup', 'station-clients'] as const,
    queryFn: ({ signal }) => apiClient.get(`${setupApiBase}/station-clients`, { schema: responseSchema, signal }),
  });

export function useStationClients() {
  return useQuery(stationClientsQueryOptions());
}
