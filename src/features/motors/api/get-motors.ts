import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { motorStatusSchema, type MotorStatus } from './motor-schemas';

export const motorSortKeys = ['serial', 'lastTestedAt'] as const;
export type MotorSortKey = (typeof motorSortKeys)[number];
export type SortOrder = 'asc' | 'desc';

export type MotorFilters = {
  product?: string;
  lot?: string;
  status?: MotorStatus;
  station?: string;
  from?: string;
  to?: string;
  serialPrefix?: string;
};

export type MotorListQuery = MotorFilters & {
  sort: MotorSortKey;
  order: SortOrder;
  limit: number;
  cursor?: string;
};

const motorListSchema = z.object({
  items: z.array(
    z.object({
      serial: z.string(),
      product: z.string(),
      lot: z.string(),
      status: motorStatusSchema,
      lastTestedAt: z.string().nullable(),
    }),
  ),
  nextCursor: z.string().nullable(),
});
export type MotorList = z.infer<typeof motorListSchema>;
export type MotorListItem = MotorList['items'][number];

export function getMotors(query: MotorListQuery, signal?: AbortSignal): Promise<MotorList> {
  return apiClient.get('/api/v1/motors', { schema: motorListSchema, params: query, signal });
}

export const motorsQueryOptions = (query: MotorListQuery) =>
  queryOptions({
    queryKey: ['motors', 'list', query] as const,
    queryFn: ({ signal }) => getMotors(query, signal),
    // Keep the current page on screen while the next one loads, so the table does not jump.
    placeholderData: keepPreviousData,
  });

export function useMotors(query: MotorListQuery) {
  return useQuery(motorsQueryOptions(query));
}
