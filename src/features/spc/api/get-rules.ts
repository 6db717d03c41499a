import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';

export const ruleChoicesSchema = z.object({
  rules: z.array(z.object({ rule: z.string(), text: z.string(), family: z.enum(['nelson', 'western-electric']), isDefault: z.boolean() })),
});
export type RuleChoice = z.infer<typeof ruleChoicesSchema>['rules'][number];

/** The run rules and their wording come from the server, which applies them; they never change at run time. */
export const ruleChoicesQueryOptions = () =>
  queryOptions({
    queryKey: ['spc', 'rules'] as const,
    queryFn: ({ signal }) => apiClient.get('/api/v1/spc/rules', { schema: ruleChoicesSchema, signal }),
    staleTime: Infinity,
  });

export function useRuleChoices() {
  return useQuery(ruleChoicesQueryOptions());
}
