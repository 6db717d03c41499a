import type { Knex } from 'knex';

/** Brings a test database to a fresh, fully migrated state. */
export async function resetSchema(db: Knex): Promise<void> {
  await db.migrate.rollback(undefined, true);
  await db.migrate.latest();
}

const keepTables = new Set(['knex_migrations', 'knex_migrations_lock']);

/** Empties every table between tests (and restores the audit chain's genesis head). */
export async function truncateAll(db: Knex): Promise<void> {
  const [rows] = await db.raw('SELECT table_name AS name FROM information_schema.tables WHERE table_schema = DATABASE()');
  await db.raw('SET FOREIGN_KEY_CHECKS = 0');
  try {
    for (const { name } of rows as Array<{ name: string }>) {
      if (!keepTables.has(name)) await db.raw('TRUNCATE TABLE ??', [name]);
    }
  } finally {
    await db.raw('SET FOREIGN_KEY_CHECKS = 1');
  }
  await db('audit_chain_head').insert({ id: 1, last_id: 0, last_hash: '0'.repeat(64) });
}
