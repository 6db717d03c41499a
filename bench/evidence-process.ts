// The evidence-pack section in a process of its own, started fresh as the app's job runner is, with
// the same Node flags as the benchmark's process (the app's): its peak memory is then the pack's,
// not what earlier sections (or generating the data set) left behind in the benchmark's process.
// Prints the section's figures as one JSON line; progress goes to stderr.
import { loadConfig } from '../server/config.js';
import { createDb } from '../server/db/knex.js';
import { benchEvidencePack } from './evidence.js';

const db = createDb(loadConfig(process.env).db);
try {
  const figures = await benchEvidencePack({ db, log: (line) => console.error(`[bench] ${line}`) });
  process.stdout.write(`${JSON.stringify(figures)}\n`);
} finally {
  await db.destroy();
}
