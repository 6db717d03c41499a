import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import type { YieldFilter, YieldGrouping } from './yield-schemas';

const verdictSchema = z.enum(['pass', 'fail']);
const yieldMotorsSchema = z.object({
  total: z.number(),
  motors: z.array(z.object({
    serial: z.string(),
    product: z.string(),
    lot: z.string(),
    station: z.string(),
    line: z.string(),
    firstTestedAt: z.string(),
    firstVerdict: verdictSchema,
    finalVerdict: verdictSchema,
    attempts: z.number(),
    status: z.string(),
  })),
});
export type YieldMotors = z.infer<typeof yieldMotorsSchema>;

/** One bar of the board: a group of a grouping, or a failing characteristic of the Pareto. */
export type YieldDrill = { groupBy: YieldGrouping; key: string } | { characteristic: string };

export function getYieldMotors(filter: YieldFilter, drill: YieldDrill, signal?: AbortSignal): Promise<YieldMotors> {
  return apiClient.get('/api/v1/yield/motors', { schema: yieldMotorsSchema, params: { ...filter, ...drill }, signal });
}

export const yieldMotorsQueryOptions = (filter: YieldFilter, drill: YieldDrill) =>
  queryOptions({
    queryKey: ['yield', 'motors', filter, drill] as const,
    queryFn: ({ signal }) => getYieldMotors(filter, drill, signal),
  });

export function useYieldMotors(filter: YieldFilter, drill: YieldDrill | null) {
  return useQuery({ ...yieldMotorsQueryOptions(filter, drill ?? { characteristic: '' }), enabled: drill !== null });
}
