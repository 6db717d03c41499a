import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { evidencePacksQueryKey, type PackFilter } from './pack-schemas';

export function createEvidencePack(filter: PackFilter) {
  return apiClient.post('/api/v1/evidence-packs', { schema: z.object({ id: z.number() }), body: filter });
}

export function useCreateEvidencePack() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createEvidencePack,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: evidencePacksQueryKey }),
  });
}
