import type { Knex } from 'knex';
import { rebuildSpcDisplayBlocks } from '../server/services/spc/display-blocks.js';

// The control chart's display summary: per characteristic, one row per span of 256 run ids with
// the count, sums, min and max of the values stored in it. Ingest keeps it current with one
// upsert, so a chart of a million values reads a few thousand rows instead of every value. No
// foreign keys: like signal_points, a hot row that ingests share should not also lock its parents.
// Outside a transaction: MariaDB commits DDL implicitly anyway, and the rebuild commits one
// characteristic at a time. Re-running after a failed rebuild starts the summary afresh.
export const config = { transaction: false };

export async function up(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('spc_display_blocks');
  await knex.schema.createTable('spc_display_blocks', (t) => {
    t.integer('characteristic_id').unsigned().notNullable();
    t.integer('block_no').unsigned().notNullable(); // FLOOR(run_id / 256)
    t.bigInteger('first_run_id').unsigned().notNullable();
    t.bigInteger('last_run_id').unsigned().notNullable();
    t.integer('n').unsigned().notNullable();
    t.double('sum').notNullable();
    t.double('sum_sq').notNullable();
    t.double('min_value').notNullable();
    t.double('max_value').notNullable();
    t.primary(['characteristic_id', 'block_no']);
  });
  await rebuildSpcDisplayBlocks(knex);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('spc_display_blocks');
}
