import type { Knex } from 'knex';
import { genesisHash } from '../../server/services/audit/hash.js';

/** Kept across a demo reset: the schema's own bookkeeping, who has signed in, and app settings. */
const keptTables = new Set(['knex_migrations', 'knex_migrations_lock', 'users', 'sessions', 'app_meta']);

/**
 * Empties every plant table (any table the schema has, bar the kept ones, so tables added later
 * are reset too) and restarts the audit chain at its genesis, because the demo's trail is rebuilt
 * from the start by the seed itself.
 */
export async function resetPlantTables(db: Knex): Promise<void> {
  const [rows] = await db.raw('SELECT table_name AS name FROM information_schema.tables WHERE table_schema = DATABASE()');
  const tables = (rows as Array<{ name: string }>).map((row) => row.name).filter((name) => !keptTables.has(name));
  // One connection, so the session variable applies to every TRUNCATE.
  await db.transaction(async (trx) => {
    await trx.raw('SET FOREIGN_KEY_CHECKS = 0');
    try {
      for (const name of tables) await trx.raw('TRUNCATE TABLE ??', [name]);
    } finally {
      await trx.raw('SET FOREIGN_KEY_CHECKS = 1');
    }
    await trx('audit_chain_head').insert({ id: 1, last_id: 0, last_hash: genesisHash });
  });
}
