import { z } from 'zod';
import type { DraftLimitsInput } from '../../../../server/schemas/setup';
import { apiClient } from '../../../lib/api-client';
import { limitSetSchema, setupApiBase } from './setup-schemas';
import { useLimitMutation } from './use-limit-mutation';

const responseSchema = z.object({ limitSet: limitSetSchema }).transform((body) => body.limitSet);

/** Replaces all of a draft's limits with the rows the editor holds. */
export function saveDraftLimits(limitSetId: number, input: DraftLimitsInput) {
  return apiClient.put(`${setupApiBase}/limit-sets/${limitSetId}/limits`, { schema: responseSchema, body: input });
}

export function useSaveDraftLimits(productCode: string, limitSetId: number) {
  return useLimitMutation(productCode, (input: DraftLimitsInput) => saveDraftLimits(limitSetId, input));
}
