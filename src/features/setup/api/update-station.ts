import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import type { StationUpdateInput } from '../../../../server/schemas/setup';
import { apiClient } from '../../../lib/api-client';
import { setupStationsQueryOptions } from './get-stations';
import { setupApiBase, stationSchema } from './setup-schemas';

const responseSchema = z.object({ station: stationSchema }).transform((body) => body.station);

export function updateStation(code: string, input: StationUpdateInput) {
  return apiClient.put(`${setupApiBase}/stations/${encodeURIComponent(code)}`, { schema: responseSchema, body: input });
}

export function useUpdateStation(code: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: StationUpdateInput) => updateStation(code, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: setupStationsQueryOptions().queryKey }),
  });
}
