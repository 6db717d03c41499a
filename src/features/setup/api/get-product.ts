import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { characteristicSchema, productSchema, setupApiBase } from './setup-schemas';

const responseSchema = z.object({ product: productSchema, characteristics: z.array(characteristicSchema) });

/** One product with its characteristics in test order. */
export const setupProductQueryOptions = (code: string) =>
  queryOptions({
    queryKey: ['setup', 'products', code] as const,
    queryFn: ({ signal }) => apiClient.get(`${setupApiBase}/products/${encodeURIComponent(code)}`, { schema: responseSchema, signal }),
  });

export function useSetupProduct(code: string | undefined) {
  return useQuery({ ...setupProductQueryOptions(code ?? ''), enabled: Boolean(code) });
}
