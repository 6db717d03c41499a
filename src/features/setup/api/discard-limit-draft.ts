import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { setupApiBase } from './setup-schemas';
import { useLimitMutation } from './use-limit-mutation';

const responseSchema = z.object({ discarded: z.object({ id: z.number(), productCode: z.string(), revision: z.number() }) });

export function discardLimitDraft(limitSetId: number, reason?: string) {
  return apiClient.post(`${setupApiBase}/limit-sets/${limitSetId}/discard`, { schema: responseSchema, body: { reason } });
}

export function useDiscardLimitDraft(productCode: string, limitSetId: number) {
  return useLimitMutation(productCode, (reason: string | undefined) => discardLimitDraft(limitSetId, reason));
}
