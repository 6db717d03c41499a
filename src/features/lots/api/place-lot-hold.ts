import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { lotQueryKey } from './get-lot';
import { lotsQueryKey } from './get-lots';
import { lotHoldSchema, type LotHold } from './lot-schemas';

export function placeLotHold({ code, reason }: { code: string; reason: string }): Promise<LotHold> {
  return apiClient.post(`/api/v1/lots/${encodeURIComponent(code)}/holds`, { schema: lotHoldSchema, body: { reason } });
}

/** Holds every motor of the lot; the lot page and the list reload to show the new hold and counts. */
export function usePlaceLotHold() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: placeLotHold,
    onSuccess: (_hold, { code }) =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: lotQueryKey(code) }),
        queryClient.invalidateQueries({ queryKey: lotsQueryKey }),
      ]),
  });
}
