import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { uploadQueryOptions } from './get-upload';
import { uploadsQueryOptions } from './get-uploads';
import { uploadReportSchema, uploadsApiBase } from './upload-schemas';

export type UploadInput = { file: File; format: 'long' | 'wide'; delimiter: 'comma' | 'semicolon' | 'tab'; decimal: '.' | ',' };

/** Sends a file for its dry run; the answer is the report (or the earlier upload of the same file). */
export function createUpload(input: UploadInput) {
  const body = new FormData();
  body.set('format', input.format);
  body.set('delimiter', input.delimiter);
  body.set('decimal', input.decimal);
  body.set('mode', 'dry-run');
  body.set('file', input.file);
  return apiClient.post(uploadsApiBase, { schema: uploadReportSchema, body });
}

export function useCreateUpload() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createUpload,
    onSuccess: (report) => {
      queryClient.setQueryData(uploadQueryOptions(report.id).queryKey, report);
      return queryClient.invalidateQueries({ queryKey: uploadsQueryOptions().queryKey });
    },
  });
}
