import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';

const productSchema = z.object({ code: z.string(), name: z.string(), motorKind: z.string() });
const productListSchema = z.object({ items: z.array(productSchema) }).transform(({ items }) => items);
export type Product = z.infer<typeof productSchema>;

export function getProducts(signal?: AbortSignal): Promise<Product[]> {
  return apiClient.get('/api/v1/products', { schema: productListSchema, signal });
}

export const productsQueryOptions = () =>
  queryOptions({
    queryKey: ['products', 'list'] as const,
    queryFn: ({ signal }) => getProducts(signal),
    staleTime: 10 * 60_000,
  });

export function useProducts() {
  return useQuery(productsQueryOptions());
}
