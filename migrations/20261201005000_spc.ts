import type { Knex } from 'knex';

// SPC: control limits (Phase I trial, then frozen for Phase II), the per-characteristic state that
// lets each ingest judge one new point without re-reading history, signals with a database-enforced
// episode key, product subscriptions and the mail outbox written in the same transaction as a signal.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('control_limits', (t) => {
    t.increments('id').primary();
    t.integer('characteristic_id').unsigned().notNullable().references('characteristics.id');
    t.enu('chart_kind', ['individuals', 'xbar-s-lot', 'xbar-s-consecutive', 'ewma', 'cusum']).notNullable();
    t.integer('subgroup_size').nullable(); // xbar-s-consecutive only
    t.double('centre').notNullable();
    t.double('ucl').notNullable();
    t.double('lcl').notNullable();
    t.double('sigma').notNullable(); // σ of one value (within), so any subgroup size can be judged
    t.json('rules_json').notNullable(); // run rules applied in Phase II, e.g. ["nelson-1","nelson-2"]
    t.json('params_json').notNullable(); // EWMA λ, L; CUSUM k, h; the subgroup limits
    t.bigInteger('baseline_from_run_id').unsigned().notNullable();
    t.bigInteger('baseline_to_run_id').unsigned().notNullable();
    t.integer('baseline_points').notNullable();
    t.enu('status', ['trial', 'frozen', 'superseded']).notNullable();
    t.string('computed_by', 255).notNullable();
    t.datetime('computed_at', { precision: 3 }).notNullable();
    t.string('frozen_by', 255).nullable();
    t.datetime('frozen_at', { precision: 3 }).nullable();
    t.index(['characteristic_id', 'status', 'id']);
  });
  await knex.schema.createTable('control_limit_exclusions', (t) => {
    t.increments('id').primary();
    t.integer('control_limit_id').unsigned().notNullable().references('control_limits.id');
    // One point: a run (individuals, consecutive subgroups: the subgroup holding it) or a whole lot.
    t.bigInteger('run_id').unsigned().nullable();
    t.integer('lot_id').unsigned().nullable();
    t.string('reason', 1000).notNullable();
    t.string('excluded_by', 255).notNullable();
    t.datetime('excluded_at', { precision: 3 }).notNullable();
    t.unique(['control_limit_id', 'run_id']);
    t.unique(['control_limit_id', 'lot_id']);
  });
  await knex.schema.createTable('spc_state', (t) => {
    t.integer('characteristic_id').unsigned().primary().references('characteristics.id');
    t.integer('control_limit_id').unsigned().notNullable().references('control_limits.id');
    t.json('state_json').notNullable(); // trailing window, open subgroup, EWMA/CUSUM sums, active episodes
    t.bigInteger('last_run_id').unsigned().nullable();
    t.datetime('updated_at', { precision: 3 }).notNullable();
  });
  await knex.schema.createTable('signals', (t) => {
    t.increments('id').primary();
    t.integer('characteristic_id').unsigned().notNullable().references('characteristics.id');
    t.integer('product_id').unsigned().notNullable().references('products.id');
    t.integer('control_limit_id').unsigned().notNullable().references('control_limits.id');
    t.string('rule', 32).notNullable();
    t.integer('lot_id').unsigned().notNullable().references('lots.id');
    t.bigInteger('first_run_id').unsigned().notNullable(); // the run whose point started the episode
    t.bigInteger('pattern_first_run_id').unsigned().notNullable(); // earliest run in the broken pattern
    t.enu('status', ['open', 'acknowledged', 'contained', 'closed']).notNullable().defaultTo('open');
    t.string('assignee_subject', 255).nullable();
    t.string('assignee_name', 255).nullable();
    t.string('cause', 2000).nullable();
    t.string('action_taken', 2000).nullable();
    t.enu('outcome', ['released', 'scrapped', 'reworked']).nullable();
    t.datetime('opened_at', { precision: 3 }).notNullable();
    t.string('acknowledged_by', 255).nullable();
    t.datetime('acknowledged_at', { precision: 3 }).nullable();
    t.string('contained_by', 255).nullable();
    t.datetime('contained_at', { precision: 3 }).nullable();
    t.string('closed_by', 255).nullable();
    t.datetime('closed_at', { precision: 3 }).nullable();
    // One signal per characteristic, rule and episode, whoever ingests the point that starts it.
    t.unique(['characteristic_id', 'rule', 'first_run_id'], 'signals_episode');
    t.index(['status', 'id']);
    t.index(['product_id', 'status', 'id']);
  });
  // Later points of an episode. Insert-only and without a foreign key, so an ingest extending an
  // episode never waits on the signal row that a quality engineer is containing or closing.
  await knex.schema.createTable('signal_points', (t) => {
    t.integer('signal_id').unsigned().notNullable();
    t.bigInteger('run_id').unsigned().notNullable();
    t.primary(['signal_id', 'run_id']);
  });
  await knex.schema.createTable('signal_subscriptions', (t) => {
    t.increments('id').primary();
    t.string('subject', 255).notNullable();
    t.string('email', 320).notNullable();
    t.integer('product_id').unsigned().notNullable().references('products.id');
    t.datetime('created_at', { precision: 3 }).notNullable();
    t.unique(['subject', 'product_id']);
    t.index(['product_id']);
  });
  await knex.schema.createTable('mail_outbox', (t) => {
    t.bigIncrements('id').primary();
    t.string('dedupe_key', 255).notNullable().unique();
    t.string('to_address', 320).notNullable();
    t.string('subject', 500).notNullable();
    t.text('text_body').notNullable();
    t.string('link_path', 500).nullable(); // e.g. /signals/12; the sender prefixes config.publicUrl
    t.enu('status', ['pending', 'sent']).notNullable().defaultTo('pending');
    t.integer('attempts').notNullable().defaultTo(0);
    t.datetime('next_attempt_at', { precision: 3 }).notNullable();
    t.string('last_error', 1000).nullable();
    t.datetime('created_at', { precision: 3 }).notNullable();
    t.datetime('sent_at', { precision: 3 }).nullable();
    t.index(['status', 'next_attempt_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  for (const table of ['mail_outbox', 'signal_subscriptions', 'signal_points', 'signals', 'spc_state', 'control_limit_exclusions', 'control_limits']) {
    await knex.schema.dropTable(table);
  }
}
