import type { Knex } from 'knex';

// Small key/value facts about this installation (for example, that the demo plant was seeded).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('app_meta', (t) => {
    t.string('meta_key', 64).primary();
    t.string('meta_value', 1000).notNullable();
    t.datetime('updated_at', { precision: 3 }).notNullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('app_meta');
}
