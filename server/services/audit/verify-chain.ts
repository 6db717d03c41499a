import type { Knex } from 'knex';
import { jsonColumn } from '../../db/json-column.js';
import { auditHash, genesisHash, type AuditContent } from './hash.js';

export type ChainVerdict = { ok: boolean; checked: number; firstBrokenId?: number; problem?: string };

type AuditRow = {
  id: number | string; occurred_at: Date; actor: string; actor_role: string | null; action: string;
  entity_type: string; entity_id: string; before_json: unknown; after_json: unknown;
  reason: string | null; prev_hash: string; hash: string;
};

function contentOf(row: AuditRow): AuditContent {
  return {
    occurredAt: new Date(row.occurred_at).toISOString(),
    actor: row.actor,
    actorRole: row.actor_role,
    action: row.action,
    entityType: row.entity_type,
    entityId: row.entity_id,
    before: jsonColumn(row.before_json),
    after: jsonColumn(row.after_json),
    reason: row.reason,
  };
}

/**
 * Walks the whole chain in id order in pages (memory stays flat) and recomputes every hash.
 * An edited row fails its own hash; a deleted row breaks the next row's link; a deleted tail
 * no longer matches the chain head.
 */
export async function verifyAuditChain(
  db: Knex,
  onProgress?: (checked: number, total: number) => void,
  pageSize = 5000,
): Promise<ChainVerdict> {
  const head = await db('audit_chain_head').where({ id: 1 }).first();
  const totalRow = await db('audit_events').count({ n: '*' }).first();
  const total = Number(totalRow?.n ?? 0);
  let prevHash = genesisHash;
  let lastId = 0;
  let checked = 0;
  // .then() starts the query at once (a knex builder runs only when awaited).
  const page = (afterId: number): Promise<AuditRow[]> => db('audit_events').where('id', '>', afterId).orderBy('id').limit(pageSize)
    .then((rows: AuditRow[]) => rows);
  // The next page is read while this one is hashed, so the database and the hashing overlap.
  let pending = page(0);
  for (;;) {
    const rows = await pending;
    if (rows.length === 0) break;
    pending = page(Number(rows[rows.length - 1].id));
    for (const row of rows) {
      const id = Number(row.id);
      if (row.prev_hash !== prevHash) {
        await pending.catch(() => undefined);
        return { ok: false, checked, firstBrokenId: id, problem: 'link to the previous event is broken (an event before it was deleted or altered)' };
      }
      if (auditHash(prevHash, contentOf(row)) !== row.hash) {
        await pending.catch(() => undefined);
        return { ok: false, checked, firstBrokenId: id, problem: 'content does not match its hash (the event was altered)' };
      }
      prevHash = row.hash;
      lastId = id;
      checked += 1;
    }
    onProgress?.(checked, total);
  }
  if (!head || Number(head.last_id) !== lastId || head.last_hash !== prevHash) {
    return { ok: false, checked, firstBrokenId: Number(head?.last_id ?? lastId), problem: 'the newest events were deleted (chain head does not match)' };
  }
  return { ok: true, checked };
}
