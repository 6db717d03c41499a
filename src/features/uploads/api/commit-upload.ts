import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { uploadQueryOptions } from './get-upload';
import { uploadsQueryOptions } from './get-uploads';
import { uploadReportSchema, uploadsApiBase } from './upload-schemas';

export function commitUpload(id: number) {
  return apiClient.post(`${uploadsApiBase}/${id}/commit`, { schema: uploadReportSchema });
}

export function useCommitUpload() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: commitUpload,
    onSuccess: (report) => {
      queryClient.setQueryData(uploadQueryOptions(report.id).queryKey, report);
      return queryClient.invalidateQueries({ queryKey: uploadsQueryOptions().queryKey });
    },
  });
}
