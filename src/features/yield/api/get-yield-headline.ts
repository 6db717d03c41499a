import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { yieldGroupSchema } from './yield-schemas';

const headlineSchema = z.object({
  today: yieldGroupSchema,
  week: yieldGroupSchema,
  motorsOnHold: z.number(),
  openSignals: z.number().nullable(),
  firstPassTarget: z.number(),
  timeZone: z.string(),
});
export type YieldHeadline = z.infer<typeof headlineSchema>;

type HeadlineFilter = { product?: string; line?: string };

export function getYieldHeadline(filter: HeadlineFilter, signal?: AbortSignal): Promise<YieldHeadline> {
  return apiClient.get('/api/v1/yield/headline', { schema: headlineSchema, params: filter, signal });
}

export const yieldHeadlineQueryOptions = (filter: HeadlineFilter) =>
  queryOptions({
    queryKey: ['yield', 'headline', filter] as const,
    queryFn: ({ signal }) => getYieldHeadline(filter, signal),
    // Today's numbers move with every motor tested; a minute is fresh enough for a board.
    refetchInterval: 60_000,
  });

export function useYieldHeadline(filter: HeadlineFilter) {
  return useQuery(yieldHeadlineQueryOptions(filter));
}
