import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { isBusy, uploadReportSchema, uploadsApiBase } from './upload-schemas';

export const uploadQueryOptions = (id: number) =>
  queryOptions({
    queryKey: ['uploads', 'detail', id] as const,
    queryFn: ({ signal }) => apiClient.get(`${uploadsApiBase}/${id}`, { schema: uploadReportSchema, signal }),
    // Large files are checked and committed in the background; follow their progress.
    refetchInterval: (query) => (query.state.data && isBusy(query.state.data.status) ? 1000 : false),
  });

export function useUpload(id: number | undefined) {
  return useQuery({ ...uploadQueryOptions(id ?? 0), enabled: id !== undefined });
}
