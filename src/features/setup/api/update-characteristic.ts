import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import type { CharacteristicUpdateInput } from '../../../../server/schemas/setup';
import { apiClient } from '../../../lib/api-client';
import { setupProductQueryOptions } from './get-product';
import { characteristicSchema, setupApiBase } from './setup-schemas';

const responseSchema = z.object({ characteristic: characteristicSchema }).transform((body) => body.characteristic);

export function updateCharacteristic(productCode: string, code: string, input: CharacteristicUpdateInput) {
  const path = `${setupApiBase}/products/${encodeURIComponent(productCode)}/characteristics/${encodeURIComponent(code)}`;
  return apiClient.put(path, { schema: responseSchema, body: input });
}

export function useUpdateCharacteristic(productCode: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ code, input }: { code: string; input: CharacteristicUpdateInput }) => updateCharacteristic(productCode, code, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: setupProductQueryOptions(productCode).queryKey }),
  });
}
