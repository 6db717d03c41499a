import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { chartQueryKey } from './get-chart';
import { spcCharacteristicsQueryKey } from './get-characteristics';
import { limitsSchema, type Limits } from './spc-schemas';

export type TrialLimitsRequest = { characteristicId: number; chartKind: Limits['chartKind']; subgroupSize?: number; from?: string; to?: string; rules?: string[] };

export function computeTrialLimits({ characteristicId, ...body }: TrialLimitsRequest): Promise<Limits> {
  return apiClient.post(`/api/v1/spc/characteristics/${characteristicId}/trial-limits`, { schema: limitsSchema, body });
}

export function useComputeTrialLimits() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: computeTrialLimits,
    onSuccess: (_limits, { characteristicId }) => Promise.all([
      queryClient.invalidateQueries({ queryKey: chartQueryKey(characteristicId) }),
      queryClient.invalidateQueries({ queryKey: spcCharacteristicsQueryKey }),
    ]),
  });
}
