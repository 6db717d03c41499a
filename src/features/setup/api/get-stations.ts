import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { setupApiBase, stationSchema } from './setup-schemas';

const responseSchema = z.object({ stations: z.array(stationSchema) }).transform((body) => body.stations);

export const setupStationsQueryOptions = () =>
  queryOptions({
    queryKey: ['setup', 'stations'] as const,
    queryFn: ({ signal }) => apiClient.get(`${setupApiBase}/stations`, { schema: responseSchema, signal }),
  });

export function useSetupStations() {
  return useQuery(setupStationsQueryOptions());
}
