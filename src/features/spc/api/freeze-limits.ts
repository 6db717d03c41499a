import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { chartQueryKey } from './get-chart';
import { spcCharacteristicsQueryKey } from './get-characteristics';
import { limitsSchema, type Limits } from './spc-schemas';

export function freezeLimits({ limitId }: { characteristicId: number; limitId: number }): Promise<Limits> {
  return apiClient.post(`/api/v1/spc/control-limits/${limitId}/freeze`, { schema: limitsSchema, body: {} });
}

export function useFreezeLimits() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: freezeLimits,
    onSuccess: (_limits, { characteristicId }) => Promise.all([
      queryClient.invalidateQueries({ queryKey: chartQueryKey(characteristicId) }),
      queryClient.invalidateQueries({ queryKey: spcCharacteristicsQueryKey }),
    ]),
  });
}
