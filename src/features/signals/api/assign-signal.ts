import { apiClient } from '../../../lib/api-client';
import { signalSummarySchema } from './signal-schemas';
import { useSignalMutation } from './signal-mutation';

export function assignSignal({ id, assignee }: { id: string; assignee: string }) {
  return apiClient.post(`/api/v1/signals/${encodeURIComponent(id)}/assign`, { schema: signalSummarySchema, body: { assignee } });
}

export const useAssignSignal = () => useSignalMutation(assignSignal);
