import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('products', (t) => {
    t.increments('id').primary();
    t.string('code', 32).notNullable().unique();
    t.string('name', 200).notNullable();
    t.enu('motor_kind', ['pmsm', 'induction', 'dc']).notNullable();
    t.integer('pole_pairs').notNullable();
    t.integer('resolver_pole_pairs').nullable();
    t.double('rated_voltage_v').notNullable();
    t.double('rated_power_kw').notNullable();
    t.double('rated_speed_rpm').notNullable();
    t.enu('winding_material', ['copper', 'aluminium']).notNullable();
    t.enu('winding_type', ['random', 'form']).notNullable().defaultTo('random');
    t.string('insulation_class', 1).notNullable();
    t.string('serial_pattern', 200).notNullable();
    t.datetime('created_at', { precision: 3 }).notNullable();
  });
  await knex.schema.createTable('characteristics', (t) => {
    t.increments('id').primary();
    t.integer('product_id').unsigned().notNullable().references('products.id');
    t.string('code', 64).notNullable();
    t.string('name', 200).notNullable();
    t.string('unit', 32).notNullable();
    t.string('test_step', 64).notNullable();
    t.boolean('spc_enabled').notNullable().defaultTo(false);
    t.enu('subgroup_mode', ['individual', 'lot', 'consecutive']).notNullable().defaultTo('individual');
    t.integer('subgroup_size').nullable();
    t.boolean('derived').notNullable().defaultTo(false); // computed by Fluxtrail from raw readings or waveforms
    t.integer('sort_order').notNullable().defaultTo(0);
    t.unique(['product_id', 'code']);
  });
  await knex.schema.createTable('limit_sets', (t) => {
    t.increments('id').primary();
    t.integer('product_id').unsigned().notNullable().references('products.id');
    t.integer('revision').notNullable();
    t.enu('status', ['draft', 'approved', 'retired']).notNullable();
    t.datetime('effective_from', { precision: 3 }).nullable();
    t.string('note', 1000).nullable();
    t.string('authored_by', 255).notNullable(); // IdP subject
    t.string('authored_by_name', 255).notNullable();
    t.datetime('authored_at', { precision: 3 }).notNullable();
    t.string('approved_by', 255).nullable();
    t.string('approved_by_name', 255).nullable();
    t.datetime('approved_at', { precision: 3 }).nullable();
    t.datetime('retired_at', { precision: 3 }).nullable();
    t.unique(['product_id', 'revision']);
    t.index(['product_id', 'status', 'effective_from'], 'limit_sets_in_force');
  });
  await knex.schema.createTable('limits', (t) => {
    t.increments('id').primary();
    t.integer('limit_set_id').unsigned().notNullable().references('limit_sets.id');
    t.integer('characteristic_id').unsigned().notNullable().references('characteristics.id');
    t.double('lsl').nullable();
    t.double('nominal').nullable();
    t.double('usl').nullable();
    t.unique(['limit_set_id', 'characteristic_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  for (const table of ['limits', 'limit_sets', 'characteristics', 'products']) await knex.schema.dropTable(table);
}
