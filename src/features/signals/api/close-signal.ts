import { apiClient } from '../../../lib/api-client';
import { signalSummarySchema } from './signal-schemas';
import { useSignalMutation } from './signal-mutation';

export type Disposition = { cause: string; actionTaken: string; outcome: 'released' | 'scrapped' | 'reworked' };

export function closeSignal({ id, ...disposition }: { id: string } & Disposition) {
  return apiClient.post(`/api/v1/signals/${encodeURIComponent(id)}/close`, { schema: signalSummarySchema, body: disposition });
}

export const useCloseSignal = () => useSignalMutation(closeSignal);
