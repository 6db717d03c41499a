import type { Knex } from 'knex';
import { join } from 'node:path';
import { seedDemoPlant } from './demo/seed-demo-plant.js';
import { fileBlobStore } from '../server/blob-store/file-blob-store.js';

/** About this many motors unless FLUXTRAIL_DEMO_MOTORS says otherwise (browser tests use a few hundred). */
const defaultMotors = 5000;
const maxMotors = 50_000;

function demoMotors(value: string | undefined): number {
  if (value === undefined || value === '') return defaultMotors;
  const motors = Number(value);
  if (!Number.isInteger(motors) || motors < 1 || motors > maxMotors) {
    throw new Error(`FLUXTRAIL_DEMO_MOTORS must be a whole number from 1 to ${maxMotors}, got ${value}`);
  }
  return motors;
}

/** knex seed: the invented demo plant (see seeds/demo/). */
export async function seed(knex: Knex): Promise<void> {
  // Raw samples go where the app reads them: the same data directory the server is configured with.
  const blobs = fileBlobStore(join(process.env.FLUXTRAIL_DATA_DIR ?? '.data', 'blobs'));
  const report = await seedDemoPlant(knex, { motors: demoMotors(process.env.FLUXTRAIL_DEMO_MOTORS), blobs });
  console.log(`Demo plant: ${report.motors} motors, ${report.runs} runs in ${(report.elapsedMs / 1000).toFixed(1)} s.`);
}
