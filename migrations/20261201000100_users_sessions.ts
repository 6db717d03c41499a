import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('users', (t) => {
    t.increments('id').primary();
    t.string('subject', 255).notNullable().unique();
    t.string('name', 255).notNullable();
    t.string('email', 255).notNullable();
    t.string('role', 32).notNullable();
    t.datetime('first_seen_at', { precision: 3 }).notNullable();
    t.datetime('last_seen_at', { precision: 3 }).notNullable();
  });
  // Schema expected by connect-session-knex (created here so the store never alters the database).
  await knex.schema.createTable('sessions', (t) => {
    t.string('sid', 255).primary();
    t.json('sess').notNullable();
    t.datetime('expired').notNullable().index();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('sessions');
  await knex.schema.dropTable('users');
}
