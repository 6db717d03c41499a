import type { Knex } from 'knex';
import { jsonColumn } from '../../db/json-column.js';

export type AuditEventView = {
  id: number; occurredAt: string; actor: string; actorRole: string | null; action: string;
  entityType: string; entityId: string; before: unknown; after: unknown; reason: string | null;
};

/** The audit events recorded against any of the given entities, oldest first (bounded). */
export async function auditEventsOf(db: Knex, entities: ReadonlyArray<{ type: string; id: string }>, limit = 500): Promise<AuditEventView[]> {
  const rows = await db('audit_events')
    .where((q) => {
      for (const entity of entities) q.orWhere((e) => e.where({ entity_type: entity.type, entity_id: entity.id }));
    })
    .orderBy('id', 'asc').limit(limit);
  return rows.map((r) => ({
    id: Number(r.id), occurredAt: r.occurred_at.toISOString(), actor: r.actor, actorRole: r.actor_role, action: r.action,
    entityType: r.entity_type, entityId: r.entity_id, before: jsonColumn(r.before_json), after: jsonColumn(r.after_json), reason: r.reason,
  }));
}
