import { useMutation, useQueryClient } from '@tanstack/react-query';
import { signalQueryKey } from './get-signal';
import { signalsQueryKey } from './get-signals';

/** Every signal action reloads the signal page and the inbox (status and counts change). */
export function useSignalMutation<Input extends { id: string }, Output>(call: (input: Input) => Promise<Output>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: call,
    onSuccess: (_out, { id }) => Promise.all([
      queryClient.invalidateQueries({ queryKey: signalQueryKey(id) }),
      queryClient.invalidateQueries({ queryKey: signalsQueryKey }),
    ]),
  });
}
