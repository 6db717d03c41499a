import { z } from 'zod';
import type { RetireInput } from '../../../../server/schemas/setup';
import { apiClient } from '../../../lib/api-client';
import { limitSetSchema, setupApiBase } from './setup-schemas';
import { useLimitMutation } from './use-limit-mutation';

const responseSchema = z.object({ limitSet: limitSetSchema }).transform((body) => body.limitSet);

export function retireLimitSet(limitSetId: number, input: RetireInput) {
  return apiClient.post(`${setupApiBase}/limit-sets/${limitSetId}/retire`, { schema: responseSchema, body: input });
}

export function useRetireLimitSet(productCode: string, limitSetId: number) {
  return useLimitMutation(productCode, (input: RetireInput) => retireLimitSet(limitSetId, input));
}
