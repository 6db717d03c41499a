import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient, isApiError } from '../../../lib/api-client';
import { motorRecordSchema, type MotorRecord } from './motor-schemas';

export const motorQueryKey = (serial: string) => ['motors', 'record', serial] as const;

export function getMotor(serial: string, signal?: AbortSignal): Promise<MotorRecord> {
  return apiClient.get(`/api/v1/motors/${encodeURIComponent(serial)}`, { schema: motorRecordSchema, signal });
}

export const motorQueryOptions = (serial: string) =>
  queryOptions({
    queryKey: motorQueryKey(serial),
    queryFn: ({ signal }) => getMotor(serial, signal),
    // An unknown serial is an answer, not a hiccup: show "Serial not found" at once.
    retry: (failureCount, error) => !(isApiError(error) && error.status < 500) && failureCount < 2,
  });

export function useMotor(serial: string, { enabled = true }: { enabled?: boolean } = {}) {
  return useQuery({ ...motorQueryOptions(serial), enabled: enabled && serial !== '' });
}
