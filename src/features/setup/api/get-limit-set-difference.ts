import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { limitSetsQueryOptions } from './get-limit-sets';
import { differenceSchema, setupApiBase } from './setup-schemas';

const responseSchema = z.object({ difference: differenceSchema }).transform((body) => body.difference);

/** Keyed under the product's revisions so that any limit change refreshes the comparison too. */
export const limitSetDifferenceQueryOptions = (productCode: string, limitSetId: number) =>
  queryOptions({
    queryKey: [...limitSetsQueryOptions(productCode).queryKey, limitSetId, 'difference'] as const,
    queryFn: ({ signal }) => apiClient.get(`${setupApiBase}/limit-sets/${limitSetId}/difference`, { schema: responseSchema, signal }),
  });

export function useLimitSetDifference(productCode: string, limitSetId: number) {
  return useQuery(limitSetDifferenceQueryOptions(productCode, limitSetId));
}
