import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { hipotSchema, setupApiBase } from './setup-schemas';

const responseSchema = z.object({ hipot: hipotSchema }).transform((body) => body.hipot);

export const productHipotQueryOptions = (code: string) =>
  queryOptions({
    queryKey: ['setup', 'products', code, 'hipot'] as const,
    queryFn: ({ signal }) => apiClient.get(`${setupApiBase}/products/${encodeURIComponent(code)}/hipot`, { schema: responseSchema, signal }),
  });

export function useProductHipot(code: string) {
  return useQuery(productHipotQueryOptions(code));
}
