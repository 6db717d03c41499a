import type { Knex } from 'knex';

// Evidence packs are built by background jobs recorded here, so a pack survives the request that
// asked for it, several app processes can share the queue (row locks), and a job cut off by a
// restart is found again by its stale heartbeat.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('export_jobs', (t) => {
    t.increments('id').primary();
    t.string('requested_by', 255).notNullable(); // IdP subject
    t.string('requested_by_name', 255).notNullable();
    t.string('requested_by_role', 32).notNullable();
    t.json('filter_json').notNullable();
    t.enu('status', ['queued', 'running', 'done', 'failed', 'cancelled']).notNullable().defaultTo('queued');
    t.double('progress').notNullable().defaultTo(0); // 0…1
    t.integer('rows_done').notNullable().defaultTo(0);
    t.integer('rows_total').nullable();
    t.string('file_key', 255).nullable(); // path under the data directory
    t.bigInteger('size_bytes').nullable();
    t.specificType('sha256', 'CHAR(64)').nullable();
    t.string('error', 1000).nullable();
    t.boolean('cancel_requested').notNullable().defaultTo(false);
    t.string('worker', 128).nullable();
    t.datetime('created_at', { precision: 3 }).notNullable();
    t.datetime('heartbeat_at', { precision: 3 }).nullable();
    t.datetime('started_at', { precision: 3 }).nullable();
    t.datetime('finished_at', { precision: 3 }).nullable();
    t.index(['status', 'id'], 'export_jobs_queue');
    t.index(['created_at', 'id'], 'export_jobs_history');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('export_jobs');
}
