import type { Knex } from 'knex';

// Lots, motors, stations, test runs and measurements. Measurements are never updated or deleted.
// Hot paths: a serial's runs and results (motors.serial → test_runs(motor_id) → measurements PK)
// and one characteristic's time series for SPC (covering index characteristic_id, run_id, value).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('lots', (t) => {
    t.increments('id').primary();
    t.string('code', 64).notNullable().unique();
    t.integer('product_id').unsigned().notNullable().references('products.id');
    t.datetime('created_at', { precision: 3 }).notNullable();
  });
  await knex.schema.createTable('lot_components', (t) => {
    t.increments('id').primary();
    t.integer('lot_id').unsigned().notNullable().references('lots.id');
    t.enu('component_kind', ['stator', 'magnet', 'rotor', 'resolver']).notNullable();
    t.string('supplier_lot_code', 64).notNullable();
    t.string('supplier', 200).nullable();
    t.unique(['lot_id', 'component_kind', 'supplier_lot_code']);
    t.index(['supplier_lot_code'], 'lot_components_where_used');
  });
  await knex.schema.createTable('stations', (t) => {
    t.increments('id').primary();
    t.string('code', 32).notNullable().unique();
    t.string('line', 32).notNullable();
    t.string('kind', 64).notNullable();
    t.string('name', 200).notNullable();
    t.date('calibration_due').notNullable();
    t.boolean('active').notNullable().defaultTo(true);
  });
  await knex.schema.createTable('station_calibrations', (t) => {
    t.increments('id').primary();
    t.integer('station_id').unsigned().notNullable().references('stations.id');
    t.date('calibrated_on').notNullable();
    t.date('due').notNullable();
    t.string('certificate', 200).nullable();
    t.string('recorded_by', 255).notNullable();
    t.datetime('recorded_at', { precision: 3 }).notNullable();
    t.index(['station_id', 'calibrated_on']);
  });
  await knex.schema.createTable('station_clients', (t) => {
    t.string('client_id', 128).primary();
    t.integer('station_id').unsigned().notNullable().references('stations.id');
  });
  await knex.schema.createTable('motors', (t) => {
    t.increments('id').primary();
    t.string('serial', 64).notNullable().unique();
    t.integer('product_id').unsigned().notNullable().references('products.id');
    t.integer('lot_id').unsigned().notNullable().references('lots.id');
    // Derived from the latest run and the holds, kept current in the same transaction as each change.
    t.enu('status', ['passed', 'failed', 'on hold', 'not tested']).notNullable().defaultTo('not tested');
    t.integer('attempts').notNullable().defaultTo(0);
    t.bigInteger('latest_run_id').unsigned().nullable();
    t.integer('last_station_id').unsigned().nullable();
    t.datetime('last_tested_at', { precision: 3 }).nullable();
    t.datetime('created_at', { precision: 3 }).notNullable();
    t.index(['product_id', 'serial']);
    t.index(['lot_id', 'serial']);
    t.index(['status', 'serial']);
    t.index(['last_station_id', 'serial']);
    t.index(['last_tested_at', 'id']);
  });
  await knex.schema.createTable('test_runs', (t) => {
    t.bigIncrements('id').primary();
    t.specificType('run_uuid', 'CHAR(36)').notNullable().unique();
    t.integer('motor_id').unsigned().notNullable().references('motors.id');
    t.integer('station_id').unsigned().notNullable().references('stations.id');
    t.integer('lot_id').unsigned().notNullable().references('lots.id');
    t.integer('attempt').notNullable();
    t.datetime('started_at', { precision: 3 }).notNullable();
    t.datetime('finished_at', { precision: 3 }).notNullable();
    t.string('operator_badge', 64).notNullable();
    t.string('program_version', 64).notNullable();
    t.integer('limit_set_id').unsigned().nullable().references('limit_sets.id');
    t.enu('verdict', ['pass', 'fail']).notNullable();
    t.boolean('calibration_ok').notNullable();
    t.date('calibration_due').notNullable(); // as it stood when the run was received
    t.specificType('body_sha256', 'CHAR(64)').notNullable(); // idempotent retries compare this
    t.json('response_json').notNullable(); // the answer given, returned again on a retry
    t.enu('source', ['station', 'upload']).notNullable().defaultTo('station');
    t.integer('upload_id').unsigned().nullable();
    t.datetime('received_at', { precision: 3 }).notNullable();
    t.unique(['motor_id', 'attempt']);
    t.index(['started_at']);
    t.index(['station_id', 'started_at']);
    t.index(['lot_id', 'started_at']);
  });
  await knex.schema.createTable('measurements', (t) => {
    t.bigInteger('run_id').unsigned().notNullable().references('test_runs.id');
    t.integer('characteristic_id').unsigned().notNullable().references('characteristics.id');
    t.double('value').notNullable();
    t.double('lsl').nullable();
    t.double('usl').nullable();
    t.enu('verdict', ['pass', 'fail']).notNullable();
    t.primary(['run_id', 'characteristic_id']);
    t.index(['characteristic_id', 'run_id', 'value'], 'measurements_series');
  });
  await knex.schema.createTable('raw_readings', (t) => {
    t.bigInteger('run_id').unsigned().notNullable().references('test_runs.id');
    t.string('kind', 32).notNullable(); // insulation, hipot, winding-resistance
    t.json('reading_json').notNullable();
    t.primary(['run_id', 'kind']);
  });
  await knex.schema.createTable('waveforms', (t) => {
    t.bigIncrements('id').primary();
    t.bigInteger('run_id').unsigned().notNullable().references('test_runs.id');
    t.string('kind', 32).notNullable();
    t.double('sample_rate_hz').notNullable();
    t.double('speed_rpm').notNullable();
    t.integer('samples_per_channel').notNullable();
    t.specificType('blob_sha256', 'CHAR(64)').notNullable();
    t.json('summary_json').notNullable();
    t.index(['run_id']);
  });
  await knex.schema.createTable('holds', (t) => {
    t.increments('id').primary();
    t.integer('motor_id').unsigned().nullable().references('motors.id');
    t.integer('lot_id').unsigned().nullable().references('lots.id');
    t.enu('kind', ['manual', 'calibration', 'signal']).notNullable();
    t.string('reason', 1000).notNullable();
    t.integer('signal_id').unsigned().nullable();
    t.string('placed_by', 255).notNullable();
    t.datetime('placed_at', { precision: 3 }).notNullable();
    t.string('released_by', 255).nullable();
    t.datetime('released_at', { precision: 3 }).nullable();
    t.string('release_reason', 1000).nullable();
    t.index(['motor_id', 'released_at']);
    t.index(['lot_id', 'released_at']);
  });
  await knex.schema.createTable('rework_notes', (t) => {
    t.increments('id').primary();
    t.integer('motor_id').unsigned().notNullable().references('motors.id');
    t.enu('action', ['rework', 'retest']).notNullable();
    t.string('note', 2000).notNullable();
    t.string('recorded_by', 255).notNullable();
    t.datetime('recorded_at', { precision: 3 }).notNullable();
    t.index(['motor_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  for (const table of ['rework_notes', 'holds', 'waveforms', 'raw_readings', 'measurements', 'test_runs', 'motors', 'station_clients', 'station_calibrations', 'stations', 'lot_components', 'lots']) {
    await knex.schema.dropTable(table);
  }
}
