import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { stationClientsQueryOptions } from './get-station-clients';
import { setupApiBase, stationClientSchema } from './setup-schemas';

const responseSchema = z.object({ stationClient: stationClientSchema }).transform((body) => body.stationClient);

export function unbindStationClient(clientId: string) {
  return apiClient.post(`${setupApiBase}/station-clients/${encodeURIComponent(clientId)}/unbind`, { schema: responseSchema, body: {} });
}

export function useUnbindStationClient() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: unbindStationClient,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: stationClientsQueryOptions().queryKey }),
  });
}
