// Migrates the database and, with --seed-demo, seeds the invented demo plant once.
import { loadConfig } from '../server/config.js';
import { createDb } from '../server/db/knex.js';

const config = loadConfig();
const db = createDb(config.db);
try {
  const [, applied] = await db.migrate.latest();
  if (applied.length) console.log(`Applied ${applied.length} migration(s).`);
  if (process.argv.includes('--seed-demo')) {
    const seeded = await db('app_meta').where({ meta_key: 'demo_seeded_at' }).first();
    if (seeded) {
      console.log(`Demo plant already seeded (${seeded.meta_value}); keeping the data.`);
    } else {
      console.log('Seeding the demo plant…');
      const [files] = await db.seed.run();
      if (files.length === 0) throw new Error('No seed files found in seeds/; the demo plant cannot be seeded.');
      await db('app_meta').insert({ meta_key: 'demo_seeded_at', meta_value: new Date().toISOString(), updated_at: new Date() });
      console.log('Demo plant seeded.');
    }
  }
} finally {
  await db.destroy();
}
