import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { productSchema, setupApiBase } from './setup-schemas';

const responseSchema = z.object({ products: z.array(productSchema) }).transform((body) => body.products);

export const setupProductsQueryOptions = () =>
  queryOptions({
    queryKey: ['setup', 'products'] as const,
    queryFn: ({ signal }) => apiClient.get(`${setupApiBase}/products`, { schema: responseSchema, signal }),
  });

export function useSetupProducts() {
  return useQuery(setupProductsQueryOptions());
}
