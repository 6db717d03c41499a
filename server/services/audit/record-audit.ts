import type { Knex } from 'knex';
import { auditHash, canonicalJson, type AuditContent } from './hash.js';

export type Actor = { name: string; role: string | null };

export type AuditInput = {
  actor: Actor;
  action: string;
  entityType: string;
  entityId: string | number;
  before?: unknown;
  after?: unknown;
  reason?: string | null;
  at?: Date;
};

/**
 * Appends one event to the audit chain inside the caller's transaction, so the change and its
 * record commit together. The chain head row is locked, which serialises writers across processes.
 */
export async function recordAudit(trx: Knex.Transaction, input: AuditInput): Promise<number> {
  const head = await trx('audit_chain_head').where({ id: 1 }).forUpdate().first();
  if (!head) throw new Error('audit_chain_head is missing; run the migrations');
  const occurredAt = new Date(Math.floor((input.at ?? new Date()).getTime()));
  const content: AuditContent = {
    occurredAt: occurredAt.toISOString(),
    actor: input.actor.name,
    actorRole: input.actor.role,
    action: input.action,
    entityType: input.entityType,
    entityId: String(input.entityId),
    before: normalise(input.before),
    after: normalise(input.after),
    reason: input.reason ?? null,
  };
  const hash = auditHash(head.last_hash, content);
  const [id] = await trx('audit_events').insert({
    occurred_at: occurredAt,
    actor: content.actor,
    actor_role: content.actorRole,
    action: content.action,
    entity_type: content.entityType,
    entity_id: content.entityId,
    before_json: content.before === null ? null : canonicalJson(content.before),
    after_json: content.after === null ? null : canonicalJson(content.after),
    reason: content.reason,
    prev_hash: head.last_hash,
    hash,
  });
  await trx('audit_chain_head').where({ id: 1 }).update({ last_id: id, last_hash: hash });
  return Number(id);
}

/** Round-trips through JSON so what is hashed is exactly what the database returns later. */
function normalise(value: unknown): unknown {
  if (value === undefined || value === null) return null;
  return JSON.parse(canonicalJson(value));
}
