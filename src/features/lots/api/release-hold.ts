import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { lotQueryKey } from './get-lot';
import { lotsQueryKey } from './get-lots';
import { lotHoldSchema, type LotHold } from './lot-schemas';

export type ReleaseHoldInput = { holdId: number; reason: string; lotCode: string };

export function releaseHold({ holdId, reason }: ReleaseHoldInput): Promise<LotHold> {
  return apiClient.post(`/api/v1/holds/${holdId}/release`, { schema: lotHoldSchema, body: { reason } });
}

export function useReleaseHold() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: releaseHold,
    onSuccess: (_hold, { lotCode }) =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: lotQueryKey(lotCode) }),
        queryClient.invalidateQueries({ queryKey: lotsQueryKey }),
      ]),
  });
}
