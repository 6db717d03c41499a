import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';

const whereUsedSchema = z.object({
  componentLot: z.string(),
  lots: z.array(z.object({ code: z.string(), product: z.string(), componentKind: z.string(), supplier: z.string().nullable(), motorCount: z.number(), onHold: z.boolean() })),
  motors: z.array(z.object({ serial: z.string(), lot: z.string(), product: z.string(), status: z.string(), onHold: z.boolean() })),
  motorsTruncated: z.boolean(),
});
export type WhereUsed = z.infer<typeof whereUsedSchema>;

export function getWhereUsed(code: string, signal?: AbortSignal) {
  return apiClient.get(`/api/v1/trace/component-lots/${encodeURIComponent(code)}`, { schema: whereUsedSchema, signal });
}

export const whereUsedQueryOptions = (code: string) =>
  queryOptions({ queryKey: ['trace', 'component-lot', code] as const, queryFn: ({ signal }) => getWhereUsed(code, signal), enabled: code.length > 0 });

export function useWhereUsed(code: string) {
  return useQuery(whereUsedQueryOptions(code));
}
