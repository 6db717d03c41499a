import { apiClient } from '../../../lib/api-client';
import { signalSummarySchema } from './signal-schemas';
import { useSignalMutation } from './signal-mutation';

export function acknowledgeSignal({ id }: { id: string }) {
  return apiClient.post(`/api/v1/signals/${encodeURIComponent(id)}/acknowledge`, { schema: signalSummarySchema, body: {} });
}

export const useAcknowledgeSignal = () => useSignalMutation(acknowledgeSignal);
