import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { motorQueryKey } from './get-motor';

export type ReworkAction = 'rework' | 'retest';

export type ReworkNoteInput = { serial: string; action: ReworkAction; note: string };

export function recordReworkNote({ serial, action, note }: ReworkNoteInput): Promise<unknown> {
  return apiClient.post(`/api/v1/motors/${encodeURIComponent(serial)}/rework-notes`, {
    schema: z.unknown(),
    body: { action, note },
  });
}

/** Records a rework note or a retest request; the motor record reloads so the note and its audit event show. */
export function useRecordReworkNote() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: recordReworkNote,
    onSuccess: (_data, { serial }) => queryClient.invalidateQueries({ queryKey: motorQueryKey(serial) }),
  });
}
