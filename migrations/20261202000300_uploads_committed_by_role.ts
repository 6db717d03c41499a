import type { Knex } from 'knex';

// A commit interrupted by a restart is taken up again by the next process (server/jobs/
// upload-passes.ts), which writes the commit's audit event in the name of the person who asked
// for it: their role is kept with their name so that event is the same as an uninterrupted one.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('uploads', (t) => {
    t.string('committed_by_role', 64).nullable().after('committed_by_name');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('uploads', (t) => {
    t.dropColumn('committed_by_role');
  });
}
