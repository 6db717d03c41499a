import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import type { StationCreateInput } from '../../../../server/schemas/setup';
import { apiClient } from '../../../lib/api-client';
import { setupStationsQueryOptions } from './get-stations';
import { setupApiBase, stationSchema } from './setup-schemas';

const responseSchema = z.object({ station: stationSchema }).transform((body) => body.station);

export function createStation(input: StationCreateInput) {
  return apiClient.post(`${setupApiBase}/stations`, { schema: responseSchema, body: input });
}

export function useCreateStation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createStation,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: setupStationsQueryOptions().queryKey }),
  });
}
