import type { Knex } from 'knex';

// The plant shift calendar with its settings, and the yield rollups kept current by ingest.
// Rollups exist because the board must answer within 200 ms for a year of a plant (250k motors,
// 10M measurements): a GROUP BY over one narrow row per motor is fast, a join of first runs with
// their measurements is not. Times are bucketed by UTC quarter hour (minutes since the epoch DIV 15)
// so that the plant's shifts and time zone can change without rewriting the rollups.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('yield_settings', (t) => {
    t.integer('id').primary(); // always 1: one plant per installation
    t.string('time_zone', 64).notNullable();
    t.double('first_pass_target').notNullable();
    t.string('updated_by', 255).notNullable();
    t.datetime('updated_at', { precision: 3 }).notNullable();
  });
  await knex.schema.createTable('plant_shifts', (t) => {
    t.increments('id').primary();
    t.string('code', 16).notNullable().unique();
    t.string('name', 64).notNullable();
    t.integer('starts_minute').notNullable(); // minutes after local midnight; a shift runs until the next one starts
  });
  await knex.schema.createTable('yield_motors', (t) => {
    t.integer('motor_id').unsigned().primary();
    t.integer('product_id').unsigned().notNullable();
    t.integer('lot_id').unsigned().notNullable();
    t.integer('station_id').unsigned().notNullable(); // of the first run
    t.string('line', 32).notNullable(); // of the first run's station, as it stood then
    t.bigInteger('first_run_id').unsigned().notNullable();
    t.datetime('first_started_at', { precision: 3 }).notNullable();
    t.integer('first_quarter').notNullable();
    t.boolean('first_pass').notNullable();
    t.boolean('final_pass').notNullable();
    t.integer('attempts').notNullable();
    // Covering indexes: each filter column first, then the bucket and both verdicts.
    t.index(['first_quarter', 'first_pass', 'final_pass'], 'yield_motors_time');
    t.index(['product_id', 'first_quarter', 'first_pass', 'final_pass'], 'yield_motors_product');
    t.index(['line', 'first_quarter', 'first_pass', 'final_pass'], 'yield_motors_line');
    t.index(['station_id', 'first_quarter', 'first_pass', 'final_pass'], 'yield_motors_station');
    t.index(['lot_id', 'first_quarter', 'first_pass', 'final_pass'], 'yield_motors_lot');
  });
  await knex.schema.createTable('yield_first_failures', (t) => {
    t.integer('motor_id').unsigned().notNullable();
    t.integer('characteristic_id').unsigned().notNullable();
    t.integer('product_id').unsigned().notNullable();
    t.integer('lot_id').unsigned().notNullable();
    t.integer('station_id').unsigned().notNullable();
    t.string('line', 32).notNullable();
    t.integer('first_quarter').notNullable();
    t.primary(['motor_id', 'characteristic_id']);
    t.index(['first_quarter', 'characteristic_id'], 'yield_failures_time');
    t.index(['characteristic_id', 'first_quarter'], 'yield_failures_characteristic');
  });
  // Runs stored before this migration: fill the rollups once from the record tables.
  await knex.raw(`
    INSERT INTO yield_motors (motor_id, product_id, lot_id, station_id, line, first_run_id, first_started_at, first_quarter, first_pass, final_pass, attempts)
    SELECT m.id, m.product_id, m.lot_id, f.station_id, s.line, f.id, f.started_at,
           TIMESTAMPDIFF(MINUTE, '1970-01-01 00:00:00', f.started_at) DIV 15, f.verdict = 'pass', l.verdict = 'pass', m.attempts
    FROM motors m
    JOIN test_runs f ON f.motor_id = m.id AND f.attempt = 1
    JOIN test_runs l ON l.motor_id = m.id AND l.attempt = m.attempts
    JOIN stations s ON s.id = f.station_id`);
  await knex.raw(`
    INSERT INTO yield_first_failures (motor_id, characteristic_id, product_id, lot_id, station_id, line, first_quarter)
    SELECT y.motor_id, ms.characteristic_id, y.product_id, y.lot_id, y.station_id, y.line, y.first_quarter
    FROM yield_motors y JOIN measurements ms ON ms.run_id = y.first_run_id AND ms.verdict = 'fail'`);
}

export async function down(knex: Knex): Promise<void> {
  for (const table of ['yield_first_failures', 'yield_motors', 'plant_shifts', 'yield_settings']) {
    await knex.schema.dropTable(table);
  }
}
