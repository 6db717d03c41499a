import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { evidencePackSchema, evidencePacksQueryKey } from './pack-schemas';

const packListSchema = z.object({ items: z.array(evidencePackSchema), nextCursor: z.string().nullable() });

export function getEvidencePacks(signal?: AbortSignal) {
  return apiClient.get('/api/v1/evidence-packs', { schema: packListSchema, params: { limit: 50 }, signal });
}

export const evidencePacksQueryOptions = () =>
  queryOptions({
    queryKey: [...evidencePacksQueryKey, 'list'] as const,
    queryFn: ({ signal }) => getEvidencePacks(signal),
    // Poll only while a pack is being built, so an idle screen costs nothing.
    refetchInterval: (query) => (query.state.data?.items.some((p) => p.status === 'queued' || p.status === 'running') ? 1000 : false),
  });

export function useEvidencePacks() {
  return useQuery(evidencePacksQueryOptions());
}
