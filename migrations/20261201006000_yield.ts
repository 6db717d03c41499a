import type { Knex } from 'knex';

// The plant shift calendar with its settings, and the yield rollups kept current by ingest.
// Rollups exist because the board must answer within 200 ms for a year of a plant (250k motors,
// 10M measurements): a GROUP BY over one narrow row per motor is fast, a join of first runs with
// their measurements is not.
// Each motor is filed under the production day and shift of its first run; a change of the shift
// calendar or time zone refiles them (recompute-shift-slots.ts) in the same audited transaction.
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
    t.date('shift_day').notNullable(); // production day of the first run in the calendar now in force
    t.string('shift_code', 16).notNullable();
    t.boolean('first_pass').notNullable();
    t.boolean('final_pass').notNullable();
    t.integer('attempts').notNullable();
    t.index(['shift_day', 'shift_code'], 'yield_motors_day');
    t.index(['first_started_at'], 'yield_motors_started');
  });
  // Counts per production day, shift, station and lot: a year of a plant is tens of thousands of
  // rows rather than 250k motors, which keeps every grouping of the board well under 200 ms.
  await knex.schema.createTable('yield_counts', (t) => {
    t.date('shift_day').notNullable();
    t.string('shift_code', 16).notNullable();
    t.integer('station_id').unsigned().notNullable();
    t.string('line', 32).notNullable();
    t.integer('lot_id').unsigned().notNullable();
    t.integer('product_id').unsigned().notNullable();
    t.integer('tested').notNullable();
    t.integer('passed_first').notNullable();
    t.integer('passed_final').notNullable();
    t.primary(['shift_day', 'shift_code', 'station_id', 'line', 'lot_id', 'product_id']);
  });
  await knex.schema.createTable('yield_first_failures', (t) => {
    t.integer('motor_id').unsigned().notNullable();
    t.integer('characteristic_id').unsigned().notNullable();
    t.integer('product_id').unsigned().notNullable();
    t.integer('lot_id').unsigned().notNullable();
    t.integer('station_id').unsigned().notNullable();
    t.string('line', 32).notNullable();
    t.date('shift_day').notNullable();
    t.primary(['motor_id', 'characteristic_id']);
    t.index(['shift_day', 'characteristic_id'], 'yield_failures_day');
  });
  // Runs stored before this migration, filed under the default calendar (UTC, shifts at 06, 14, 22):
  // no calendar can have been set before its table existed.
  await knex.raw(`
    INSERT INTO yield_motors (motor_id, product_id, lot_id, station_id, line, first_run_id, first_started_at, shift_day, shift_code, first_pass, final_pass, attempts)
    SELECT m.id, m.product_id, m.lot_id, f.station_id, s.line, f.id, f.started_at,
           DATE(f.started_at - INTERVAL 6 HOUR),
           CASE WHEN HOUR(f.started_at) >= 22 OR HOUR(f.started_at) < 6 THEN 'night' WHEN HOUR(f.started_at) >= 14 THEN 'late' ELSE 'early' END,
           f.verdict = 'pass', l.verdict = 'pass', m.attempts
    FROM motors m
    JOIN test_runs f ON f.motor_id = m.id AND f.attempt = 1
    JOIN test_runs l ON l.motor_id = m.id AND l.attempt = m.attempts
    JOIN stations s ON s.id = f.station_id`);
  await knex.raw(`
    INSERT INTO yield_counts (shift_day, shift_code, station_id, line, lot_id, product_id, tested, passed_first, passed_final)
    SELECT shift_day, shift_code, station_id, line, lot_id, product_id, COUNT(*), SUM(first_pass), SUM(final_pass)
    FROM yield_motors GROUP BY shift_day, shift_code, station_id, line, lot_id, product_id`);
  await knex.raw(`
    INSERT INTO yield_first_failures (motor_id, characteristic_id, product_id, lot_id, station_id, line, shift_day)
    SELECT y.motor_id, ms.characteristic_id, y.product_id, y.lot_id, y.station_id, y.line, y.shift_day
    FROM yield_motors y JOIN measurements ms ON ms.run_id = y.first_run_id AND ms.verdict = 'fail'`);
}

export async function down(knex: Knex): Promise<void> {
  for (const table of ['yield_first_failures', 'yield_counts', 'yield_motors', 'plant_shifts', 'yield_settings']) {
    await knex.schema.dropTableIfExists(table);
  }
}
