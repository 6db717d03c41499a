import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { lotRecordSchema, type LotRecord } from './lot-schemas';

export const lotQueryKey = (code: string) => ['lots', 'record', code] as const;

export function getLot(code: string, signal?: AbortSignal): Promise<LotRecord> {
  return apiClient.get(`/api/v1/lots/${encodeURIComponent(code)}`, { schema: lotRecordSchema, signal });
}

export const lotQueryOptions = (code: string) =>
  queryOptions({
    queryKey: lotQueryKey(code),
    queryFn: ({ signal }) => getLot(code, signal),
  });

export function useLot(code: string) {
  return useQuery(lotQueryOptions(code));
}
