import type { Knex } from 'knex';
import { jsonColumn } from '../../db/json-column.js';

export type AuditEventFilter = {
  entityType?: string;
  entityId?: string;
  actor?: string;
  from?: Date;
  to?: Date;
  /** The id of the last event on the previous page; pages run newest first. */
  cursor?: number;
  limit: number;
};

export type AuditEventView = {
  id: number;
  occurredAt: string;
  actor: string;
  actorRole: string | null;
  action: string;
  entityType: string;
  entityId: string;
  before: unknown;
  after: unknown;
  reason: string | null;
  hash: string;
};

type Row = {
  id: number | string; occurred_at: Date; actor: string; actor_role: string | null; action: string;
  entity_type: string; entity_id: string; before_json: unknown; after_json: unknown;
  reason: string | null; hash: string;
};

export function toAuditEventView(row: Row): AuditEventView {
  return {
    id: Number(row.id),
    occurredAt: new Date(row.occurred_at).toISOString(),
    actor: row.actor,
    actorRole: row.actor_role,
    action: row.action,
    entityType: row.entity_type,
    entityId: row.entity_id,
    before: jsonColumn(row.before_json),
    after: jsonColumn(row.after_json),
    reason: row.reason,
    hash: row.hash,
  };
}

/**
 * One page of the audit trail, newest first, keyset-paged on id so deep pages cost the same as
 * the first. `to` is exclusive, so consecutive day ranges never count an event twice.
 */
export async function listAuditEvents(db: Knex, filter: AuditEventFilter): Promise<{ items: AuditEventView[]; nextCursor: string | null }> {
  const query = db<Row>('audit_events').orderBy('id', 'desc').limit(filter.limit + 1);
  if (filter.entityType) query.where('entity_type', filter.entityType);
  if (filter.entityId) query.where('entity_id', filter.entityId);
  if (filter.actor) query.where('actor', filter.actor);
  if (filter.from) query.where('occurred_at', '>=', filter.from);
  if (filter.to) query.where('occurred_at', '<', filter.to);
  if (filter.cursor !== undefined) query.where('id', '<', filter.cursor);
  const rows = (await query) as Row[];
  const page = rows.slice(0, filter.limit).map(toAuditEventView);
  const more = rows.length > filter.limit;
  return { items: page, nextCursor: more ? String(page[page.length - 1].id) : null };
}
