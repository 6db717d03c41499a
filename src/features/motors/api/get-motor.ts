import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { motorRecordSchema, type MotorRecord } from './motor-schemas';

export const motorQueryKey = (serial: string) => ['motors', 'record', serial] as const;

export function getMotor(serial: string, signal?: AbortSignal): Promise<MotorRecord> {
  return apiClient.get(`/api/v1/motors/${encodeURIComponent(serial)}`, { schema: motorRecordSchema, signal });
}

export const motorQueryOptions = (serial: string) =>
  queryOptions({
    queryKey: motorQueryKey(serial),
    queryFn: ({ signal }) => getMotor(serial, signal),
    // Whether a motor may ship changes with every hold and retest: always ask again when a screen opens.
    staleTime: 0,
  });

/** `staleTimeMs` lets a screen that has just fetched the record (Scan) skip asking twice. */
export function useMotor(serial: string, staleTimeMs = 0) {
  return useQuery({ ...motorQueryOptions(serial), staleTime: staleTimeMs });
}
