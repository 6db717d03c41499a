import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { limitSetViewSchema, setupApiBase } from './setup-schemas';

const responseSchema = z.object({ limitSets: z.array(limitSetViewSchema) }).transform((body) => body.limitSets);

/** A product's limit revisions, newest first. Every limit mutation invalidates under this key. */
export const limitSetsQueryOptions = (productCode: string) =>
  queryOptions({
    queryKey: ['setup', 'limit-sets', productCode] as const,
    queryFn: ({ signal }) => apiClient.get(`${setupApiBase}/products/${encodeURIComponent(productCode)}/limit-sets`, { schema: responseSchema, signal }),
  });

export function useLimitSets(productCode: string) {
  return useQuery(limitSetsQueryOptions(productCode));
}
