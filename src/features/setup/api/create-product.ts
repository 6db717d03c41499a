import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import type { ProductCreateInput } from '../../../../server/schemas/setup';
import { apiClient } from '../../../lib/api-client';
import { setupProductsQueryOptions } from './get-products';
import { productSchema, setupApiBase } from './setup-schemas';

const responseSchema = z.object({ product: productSchema }).transform((body) => body.product);

export function createProduct(input: ProductCreateInput) {
  return apiClient.post(`${setupApiBase}/products`, { schema: responseSchema, body: input });
}

export function useCreateProduct() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createProduct,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: setupProductsQueryOptions().queryKey }),
  });
}
