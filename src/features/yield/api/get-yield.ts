import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { yieldGroupSchema, type YieldFilter, type YieldGrouping } from './yield-schemas';

const yieldAnswerSchema = z.object({
  from: z.string(),
  to: z.string(),
  groups: z.array(yieldGroupSchema),
  pareto: z.array(z.object({ characteristic: z.string(), name: z.string(), failures: z.number(), share: z.number() })),
});
export type YieldAnswer = z.infer<typeof yieldAnswerSchema>;
export type ParetoEntry = YieldAnswer['pareto'][number];

export function getYield(filter: YieldFilter, groupBy: YieldGrouping, signal?: AbortSignal): Promise<YieldAnswer> {
  return apiClient.get('/api/v1/yield', { schema: yieldAnswerSchema, params: { ...filter, groupBy }, signal });
}

export const yieldQueryOptions = (filter: YieldFilter, groupBy: YieldGrouping) =>
  queryOptions({
    queryKey: ['yield', 'groups', groupBy, filter] as const,
    queryFn: ({ signal }) => getYield(filter, groupBy, signal),
    // Charts keep their last picture while a new filter loads, instead of flashing empty.
    placeholderData: keepPreviousData,
  });

export function useYield(filter: YieldFilter, groupBy: YieldGrouping) {
  return useQuery(yieldQueryOptions(filter, groupBy));
}
