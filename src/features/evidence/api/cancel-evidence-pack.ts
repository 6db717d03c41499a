import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { evidencePackSchema, evidencePacksQueryKey } from './pack-schemas';

export function cancelEvidencePack(id: number) {
  return apiClient.post(`/api/v1/evidence-packs/${id}/cancel`, { schema: evidencePackSchema });
}

export function useCancelEvidencePack() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: cancelEvidencePack,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: evidencePacksQueryKey }),
  });
}
