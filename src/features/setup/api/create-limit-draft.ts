import { z } from 'zod';
import type { DraftCreateInput } from '../../../../server/schemas/setup';
import { apiClient } from '../../../lib/api-client';
import { limitSetSchema, setupApiBase } from './setup-schemas';
import { useLimitMutation } from './use-limit-mutation';

const responseSchema = z.object({ limitSet: limitSetSchema }).transform((body) => body.limitSet);

export function createLimitDraft(productCode: string, input: DraftCreateInput) {
  return apiClient.post(`${setupApiBase}/products/${encodeURIComponent(productCode)}/limit-sets`, { schema: responseSchema, body: input });
}

export function useCreateLimitDraft(productCode: string) {
  return useLimitMutation(productCode, (input: DraftCreateInput) => createLimitDraft(productCode, input));
}
