import { infiniteQueryOptions, useInfiniteQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { lotCountsSchema } from './lot-schemas';

const lotListSchema = z.object({
  items: z.array(
    z.object({ code: z.string(), product: z.string(), createdAt: z.string(), activeHolds: z.number(), counts: lotCountsSchema }),
  ),
  nextCursor: z.string().nullable(),
});
export type LotListItem = z.infer<typeof lotListSchema>['items'][number];

const pageSize = 50;

export function getLots(cursor: string | undefined, signal?: AbortSignal) {
  return apiClient.get('/api/v1/lots', { schema: lotListSchema, params: { limit: pageSize, cursor }, signal });
}

export const lotsQueryKey = ['lots', 'list'] as const;

/** Lots newest first, a page at a time ("Show more" asks for the next page). */
export const lotsQueryOptions = () =>
  infiniteQueryOptions({
    queryKey: lotsQueryKey,
    queryFn: ({ pageParam, signal }) => getLots(pageParam, signal),
    initialPageParam: undefined as string | undefined,
    getNextPageParam: (lastPage) => lastPage.nextCursor ?? undefined,
  });

export function useLots() {
  return useInfiniteQuery(lotsQueryOptions());
}
