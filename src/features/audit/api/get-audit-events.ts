import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';

export type AuditFilters = { entityType?: string; entityId?: string; actor?: string; from?: string; to?: string };
export type AuditEventsQuery = AuditFilters & { cursor?: string; limit: number };

const auditEventSchema = z.object({
  id: z.number(),
  occurredAt: z.string(),
  actor: z.string(),
  actorRole: z.string().nullable(),
  action: z.string(),
  entityType: z.string(),
  entityId: z.string(),
  before: z.unknown(),
  after: z.unknown(),
  reason: z.string().nullable(),
  hash: z.string(),
});
export type AuditEvent = z.infer<typeof auditEventSchema>;

const auditPageSchema = z.object({ items: z.array(auditEventSchema), nextCursor: z.string().nullable() });

export function getAuditEvents(query: AuditEventsQuery, signal?: AbortSignal) {
  return apiClient.get('/api/v1/audit/events', { schema: auditPageSchema, params: query, signal });
}

export const auditEventsQueryOptions = (query: AuditEventsQuery) =>
  queryOptions({
    queryKey: ['audit', 'events', query] as const,
    queryFn: ({ signal }) => getAuditEvents(query, signal),
    placeholderData: keepPreviousData,
  });

export function useAuditEvents(query: AuditEventsQuery) {
  return useQuery(auditEventsQueryOptions(query));
}
