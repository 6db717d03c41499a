import type { Knex } from 'knex';
import { jsonColumn } from '../../db/json-column.js';
import type { Statement } from '../../db/statements.js';

export type AuditEventView = {
  id: number; occurredAt: string; actor: string; actorRole: string | null; action: string;
  entityType: string; entityId: string; before: unknown; after: unknown; reason: string | null;
};

export type AuditRow = {
  id: number | string; occurred_at: Date; actor: string; actor_role: string | null; action: string;
  entity_type: string; entity_id: string; before_json: unknown; after_json: unknown; reason: string | null;
};

/** The oldest `limit` audit events of one entity, by its index; the id may be a subquery. */
export function auditEventsOfOneStatement(db: Knex, type: string, id: string | Knex.QueryBuilder, limit = 500): Statement {
  return db('audit_events').where({ entity_type: type }).andWhere('entity_id', id).orderBy('id', 'asc').limit(limit).toSQL();
}

/** Audit rows of several entities (read apart) as one list, oldest first, at most `limit`. */
export function auditEventViews(rowsPerEntity: ReadonlyArray<readonly AuditRow[]>, limit = 500): AuditEventView[] {
  const byId = new Map(rowsPerEntity.flat().map((r) => [Number(r.id), r]));
  return [...byId.values()].sort((a, b) => Number(a.id) - Number(b.id)).slice(0, limit).map(toAuditEventView);
}

function toAuditEventView(r: AuditRow): AuditEventView {
  return {
    id: Number(r.id), occurredAt: r.occurred_at.toISOString(), actor: r.actor, actorRole: r.actor_role, action: r.action,
    entityType: r.entity_type, entityId: r.entity_id, before: jsonColumn(r.before_json), after: jsonColumn(r.after_json), reason: r.reason,
  };
}
