import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import type { CharacteristicCreateInput } from '../../../../server/schemas/setup';
import { apiClient } from '../../../lib/api-client';
import { setupProductQueryOptions } from './get-product';
import { characteristicSchema, setupApiBase } from './setup-schemas';

const responseSchema = z.object({ characteristic: characteristicSchema }).transform((body) => body.characteristic);

export function createCharacteristic(productCode: string, input: CharacteristicCreateInput) {
  return apiClient.post(`${setupApiBase}/products/${encodeURIComponent(productCode)}/characteristics`, { schema: responseSchema, body: input });
}

export function useCreateCharacteristic(productCode: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CharacteristicCreateInput) => createCharacteristic(productCode, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: setupProductQueryOptions(productCode).queryKey }),
  });
}
