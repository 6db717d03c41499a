import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { uploadSummarySchema, uploadsApiBase } from './upload-schemas';

const responseSchema = z.object({ items: z.array(uploadSummarySchema) }).transform((body) => body.items);

export const uploadsQueryOptions = () =>
  queryOptions({
    queryKey: ['uploads', 'list'] as const,
    queryFn: ({ signal }) => apiClient.get(uploadsApiBase, { schema: responseSchema, signal }),
  });

export function useUploads() {
  return useQuery(uploadsQueryOptions());
}
