import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { chartQueryKey } from './get-chart';
import { limitsSchema, type Limits } from './spc-schemas';

export type ExcludePointRequest = { characteristicId: number; limitId: number; runId?: number; lotId?: number; reason: string };

export function excludePoint({ characteristicId: _id, limitId, ...body }: ExcludePointRequest): Promise<Limits> {
  return apiClient.post(`/api/v1/spc/control-limits/${limitId}/exclusions`, { schema: limitsSchema, body });
}

export function useExcludePoint() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: excludePoint,
    onSuccess: (_limits, { characteristicId }) => queryClient.invalidateQueries({ queryKey: chartQueryKey(characteristicId) }),
  });
}
