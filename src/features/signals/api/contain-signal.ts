import { apiClient } from '../../../lib/api-client';
import { signalSummarySchema } from './signal-schemas';
import { useSignalMutation } from './signal-mutation';

export function containSignal({ id, note }: { id: string; note?: string }) {
  return apiClient.post(`/api/v1/signals/${encodeURIComponent(id)}/contain`, { schema: signalSummarySchema, body: note ? { note } : {} });
}

export const useContainSignal = () => useSignalMutation(containSignal);
