import { z } from 'zod';
import type { ApproveInput } from '../../../../server/schemas/setup';
import { apiClient } from '../../../lib/api-client';
import { limitSetSchema, setupApiBase } from './setup-schemas';
import { useLimitMutation } from './use-limit-mutation';

const responseSchema = z.object({ limitSet: limitSetSchema }).transform((body) => body.limitSet);

export function approveLimitSet(limitSetId: number, input: ApproveInput) {
  return apiClient.post(`${setupApiBase}/limit-sets/${limitSetId}/approve`, { schema: responseSchema, body: input });
}

export function useApproveLimitSet(productCode: string, limitSetId: number) {
  return useLimitMutation(productCode, (input: ApproveInput) => approveLimitSet(limitSetId, input));
}
