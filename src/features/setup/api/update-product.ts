import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import type { ProductUpdateInput } from '../../../../server/schemas/setup';
import { apiClient } from '../../../lib/api-client';
import { setupProductsQueryOptions } from './get-products';
import { productSchema, setupApiBase } from './setup-schemas';

const responseSchema = z.object({ product: productSchema }).transform((body) => body.product);

export function updateProduct(code: string, input: ProductUpdateInput) {
  return apiClient.put(`${setupApiBase}/products/${encodeURIComponent(code)}`, { schema: responseSchema, body: input });
}

/** Invalidates the list and the product (its hipot voltage follows the rating). */
export function useUpdateProduct(code: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: ProductUpdateInput) => updateProduct(code, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: setupProductsQueryOptions().queryKey }),
  });
}
