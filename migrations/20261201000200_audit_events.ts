import type { Knex } from 'knex';

// Append-only audit trail. Each row stores the SHA-256 of its own content chained to the previous
// row's hash; audit_chain_head holds the newest id and hash so the tail row's deletion is detectable too.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('audit_events', (t) => {
    t.bigIncrements('id').primary();
    t.datetime('occurred_at', { precision: 3 }).notNullable();
    t.string('actor', 255).notNullable();
    t.string('actor_role', 32).nullable();
    t.string('action', 64).notNullable();
    t.string('entity_type', 64).notNullable();
    t.string('entity_id', 255).notNullable();
    t.json('before_json').nullable();
    t.json('after_json').nullable();
    t.string('reason', 1000).nullable();
    t.specificType('prev_hash', 'CHAR(64)').notNullable();
    t.specificType('hash', 'CHAR(64)').notNullable();
    t.index(['entity_type', 'entity_id', 'id'], 'audit_events_entity');
    t.index(['actor', 'id'], 'audit_events_actor');
    t.index(['occurred_at'], 'audit_events_time');
  });
  await knex.schema.createTable('audit_chain_head', (t) => {
    t.tinyint('id').primary();
    t.bigInteger('last_id').notNullable();
    t.specificType('last_hash', 'CHAR(64)').notNullable();
  });
  await knex('audit_chain_head').insert({ id: 1, last_id: 0, last_hash: '0'.repeat(64) });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('audit_chain_head');
  await knex.schema.dropTable('audit_events');
}
