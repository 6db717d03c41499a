import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import type { ShiftCalendarBody } from '../../../../server/schemas/shift-calendar';
import { apiClient } from '../../../lib/api-client';

const calendarPath = '/api/v1/yield/shift-calendar';

export const shiftCalendarSchema = z.object({
  timeZone: z.string(),
  firstPassTarget: z.number(),
  shifts: z.array(z.object({ code: z.string(), name: z.string(), startsAt: z.string() })),
});
export type ShiftCalendarView = z.infer<typeof shiftCalendarSchema>;

export const shiftCalendarQueryOptions = () =>
  queryOptions({
    queryKey: ['setup', 'shift-calendar'] as const,
    queryFn: ({ signal }) => apiClient.get(calendarPath, { schema: shiftCalendarSchema, signal }),
  });

export function useShiftCalendar() {
  return useQuery(shiftCalendarQueryOptions());
}

export function useChangeShiftCalendar() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: ShiftCalendarBody) => apiClient.put(calendarPath, { schema: z.unknown(), body }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: shiftCalendarQueryOptions().queryKey }),
  });
}
