import { useQueryClient } from '@tanstack/react-query';
import { useCallback, useState } from 'react';
import { isApiError } from '../../../lib/api-client';
import { motorQueryOptions } from '../api/get-motor';
import { decideRelease } from '../components/scan/release-decision';
import type { ScanOutcome } from './use-recent-scans';

export type ScanState =
  | { kind: 'idle' }
  | { kind: 'looking'; serial: string }
  | { kind: 'found'; serial: string; scanId: number }
  | { kind: 'not found'; serial: string; scanId: number }
  | { kind: 'failed'; serial: string; scanId: number; error: unknown };

/**
 * Each scan asks the server afresh (a motor's status changes as it is reworked and retested),
 * then reports the outcome once so the shift list records it.
 */
export function useScanLookup(onOutcome: (serial: string, outcome: ScanOutcome) => void) {
  const queryClient = useQueryClient();
  const [state, setState] = useState<ScanState>({ kind: 'idle' });

  const lookUp = useCallback(
    async (serial: string) => {
      const scanId = Date.now();
      setState({ kind: 'looking', serial });
      try {
        const record = await queryClient.fetchQuery({ ...motorQueryOptions(serial), staleTime: 0 });
        onOutcome(record.serial, decideRelease(record).decision);
        setState({ kind: 'found', serial: record.serial, scanId });
      } catch (error) {
        if (isApiError(error) && error.status === 404) {
          onOutcome(serial, 'not found');
          setState({ kind: 'not found', serial, scanId });
        } else {
          setState({ kind: 'failed', serial, scanId, error });
        }
      }
    },
    [queryClient, onOutcome],
  );

  return { state, lookUp };
}
