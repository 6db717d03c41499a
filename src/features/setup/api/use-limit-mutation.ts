import { useMutation, useQueryClient } from '@tanstack/react-query';
import { limitSetsQueryOptions } from './get-limit-sets';

/** A mutation on one product's limit revisions; afterwards the list and its differences reload. */
export function useLimitMutation<TInput, TResult>(productCode: string, mutationFn: (input: TInput) => Promise<TResult>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: limitSetsQueryOptions(productCode).queryKey }),
  });
}
