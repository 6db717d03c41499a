import type { Knex } from 'knex';
import { recordAudit } from '../server/services/audit/record-audit.js';

// One active hold per target, kind and signal. `active_key` names the hold while it is active
// (motor or lot, kind, and the signal for containment holds, since each signal releases its own)
// and is NULL once released; its unique index makes MariaDB refuse a second active hold whichever
// process asks. Duplicates held before this migration are released first, each audited and
// pointing at the hold that stays, so no target loses its hold and nothing changes unrecorded.
// Outside a transaction: MariaDB commits DDL implicitly; the data step has its own transaction.
export const config = { transaction: false };

/** The key of a holds row, its columns read through `alias` (e.g. 'h.') when given. */
const activeKey = (alias = '') => `IF(${alias}released_at IS NULL, CONCAT_WS(':',
  IF(${alias}motor_id IS NULL, CONCAT('lot', ${alias}lot_id), CONCAT('motor', ${alias}motor_id)), ${alias}kind, ${alias}signal_id), NULL)`;

export async function up(knex: Knex): Promise<void> {
  await releaseDuplicates(knex);
  await knex.raw(`ALTER TABLE holds ADD COLUMN active_key VARCHAR(64) AS (${activeKey()}) PERSISTENT, ADD UNIQUE KEY holds_one_active (active_key)`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('ALTER TABLE holds DROP INDEX holds_one_active, DROP COLUMN active_key');
}

type DuplicateRow = { id: number; kept_id: number; kind: string; reason: string; placed_by: string; serial: string | null; lot_code: string | null };

async function releaseDuplicates(knex: Knex): Promise<void> {
  await knex.transaction(async (trx) => {
    const [rows] = await trx.raw(`
      SELECT h.id, kept.id AS kept_id, h.kind, h.reason, h.placed_by, m.serial, l.code AS lot_code
      FROM holds h
      JOIN (SELECT MIN(id) AS id, ${activeKey()} AS k FROM holds WHERE released_at IS NULL GROUP BY k HAVING COUNT(*) > 1) kept
        ON kept.k = ${activeKey('h.')} AND h.id <> kept.id
      LEFT JOIN motors m ON m.id = h.motor_id
      LEFT JOIN lots l ON l.id = h.lot_id
      ORDER BY h.id FOR UPDATE`) as [DuplicateRow[]];
    const at = new Date();
    for (const row of rows) {
      const reason = `Duplicate of active ${row.kind} hold ${row.kept_id} on the same target, which stays in force; released when duplicate holds were made impossible.`;
      await trx('holds').where({ id: row.id }).update({ released_by: 'Fluxtrail migration', released_at: at, release_reason: reason });
      await recordAudit(trx, {
        actor: { name: 'Fluxtrail migration', role: null }, action: 'hold.released',
        entityType: row.serial !== null ? 'motor' : 'lot', entityId: row.serial ?? row.lot_code ?? '',
        before: { holdId: row.id, kind: row.kind, reason: row.reason, placedBy: row.placed_by },
        after: { holdId: row.id, released: true, keptHoldId: row.kept_id }, reason, at,
      });
    }
  });
}
