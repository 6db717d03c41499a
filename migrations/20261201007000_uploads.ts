import type { Knex } from 'knex';

// Result uploads: historical or offline runs sent as a CSV or XLSX file, checked in a dry run and
// then committed through the ingest service. One row per distinct file and reading options, so a
// file committed twice answers with its first result. Each uploaded run and each problem found is
// kept beside it, so the report can be paged and the runs an upload stored can be traced back to it
// (upload_runs) without the upload touching test_runs itself.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('uploads', (t) => {
    t.increments('id').primary();
    t.specificType('upload_key', 'CHAR(64)').notNullable().unique(); // SHA-256 of file hash + reading options
    t.string('file_name', 255).notNullable();
    t.specificType('file_sha256', 'CHAR(64)').notNullable();
    t.enu('file_type', ['csv', 'xlsx']).notNullable();
    t.enu('format', ['long', 'wide']).notNullable();
    t.text('options_json').notNullable();
    t.string('uploaded_by', 255).notNullable();
    t.string('uploaded_by_name', 255).notNullable();
    t.enu('status', ['checking', 'dry-run', 'committing', 'committed', 'failed']).notNullable();
    t.integer('rows_total').notNullable().defaultTo(0);
    t.integer('rows_ok').notNullable().defaultTo(0);
    t.integer('rows_failed').notNullable().defaultTo(0);
    t.integer('runs_new').notNullable().defaultTo(0);
    t.integer('runs_stored').notNullable().defaultTo(0);
    t.integer('runs_duplicate').notNullable().defaultTo(0);
    t.integer('runs_invalid').notNullable().defaultTo(0);
    t.double('progress').notNullable().defaultTo(0);
    t.text('error').nullable();
    t.datetime('created_at', { precision: 3 }).notNullable();
    t.datetime('checked_at', { precision: 3 }).nullable();
    t.string('committed_by_name', 255).nullable();
    t.datetime('committed_at', { precision: 3 }).nullable();
    t.datetime('heartbeat_at', { precision: 3 }).nullable(); // a background pass proves it is alive
    t.index(['file_sha256'], 'uploads_file_sha256');
    t.index(['created_at'], 'uploads_created');
  });
  await knex.schema.createTable('upload_runs', (t) => {
    t.bigIncrements('id').primary();
    t.integer('upload_id').unsigned().notNullable().references('id').inTable('uploads').onDelete('CASCADE');
    t.specificType('run_uuid', 'CHAR(36)').nullable(); // null when the rows named no usable run
    t.string('serial', 64).nullable();
    t.string('station', 64).nullable();
    t.string('started_at', 40).nullable();
    t.integer('first_row').notNullable();
    t.integer('last_row').notNullable();
    t.integer('row_count').notNullable(); // data rows of the run (blank lines between them are not counted)
    t.enu('outcome', ['new', 'stored', 'duplicate', 'invalid']).notNullable();
    t.enu('verdict', ['pass', 'fail']).nullable();
    t.unique(['upload_id', 'run_uuid'], { indexName: 'upload_runs_run' });
    t.index(['upload_id', 'first_row'], 'upload_runs_row');
    t.index(['run_uuid'], 'upload_runs_uuid');
  });
  await knex.schema.createTable('upload_problems', (t) => {
    t.bigIncrements('id').primary();
    t.integer('upload_id').unsigned().notNullable().references('id').inTable('uploads').onDelete('CASCADE');
    t.integer('row_number').notNullable();
    t.string('column_name', 255).notNullable();
    t.text('message').notNullable();
    t.index(['upload_id', 'row_number'], 'upload_problems_row');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('upload_problems');
  await knex.schema.dropTableIfExists('upload_runs');
  await knex.schema.dropTableIfExists('uploads');
}
