import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import type { StationClientInput } from '../../../../server/schemas/setup';
import { apiClient } from '../../../lib/api-client';
import { stationClientsQueryOptions } from './get-station-clients';
import { setupApiBase, stationClientSchema } from './setup-schemas';

const responseSchema = z.object({ stationClient: stationClientSchema }).transform((body) => body.stationClient);

export function bindStationClient(input: StationClientInput) {
  return apiClient.post(`${setupApiBase}/station-clients`, { schema: responseSchema, body: input });
}

export function useBindStationClient() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: bindStationClient,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: stationClientsQueryOptions().queryKey }),
  });
}
