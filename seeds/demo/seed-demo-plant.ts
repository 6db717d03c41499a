import type { Knex } from 'knex';
import { forgetReferenceData } from '../../server/services/runs/reference-data.js';
import { demoClock } from './clock.js';
import { ingestPlannedRuns } from './ingest-runs.js';
import { planMotors } from './plan-motors.js';
import { resetPlantTables } from './reset.js';
import { writeLots } from './write-lots.js';
import { writeProducts } from './write-products.js';
import { writeStations } from './write-stations.js';
import { controlLimitsFrozenDaysAgo, freezeKeControlLimits } from './write-control-limits.js';
import { damagedMagnetSerials, demoSerials } from './notable.js';
import type { BlobStore } from '../../server/blob-store/blob-store.js';

/** The newest PM-150 motors post their back-EMF spin and readings raw, so the record shows waveforms. */
const rawDataMotors = 200;

/** The demo's fixed PRNG seed: the same plant, serials and values on every run. */
export const demoSeed = 20_261_201;

export type DemoSeedReport = { motors: number; runs: number; elapsedMs: number };

/**
 * Builds the invented demo plant from scratch: setup data through Setup's audited operations,
 * lots, then every test run through the real ingest service: first the weeks before quality
 * froze Ke's control limits, then the days since, which ingest judges against them.
 */
export async function seedDemoPlant(db: Knex, options: { motors: number; blobs: BlobStore; now?: Date }): Promise<DemoSeedReport> {
  const startedMs = Date.now();
  const clock = demoClock(options.now ?? new Date());
  await resetPlantTables(db);
  // Ids restart after the reset, so nothing cached in this process may survive it.
  forgetReferenceData();
  await writeProducts(db, clock);
  await writeStations(db, clock);
  await writeLots(db, clock);
  const motors = planMotors(demoSeed, clock, options.motors);
  const frozenAt = clock.at(controlLimitsFrozenDaysAgo);
  const baseline = motors.filter((m) => m.attempts[0].startedAt < frozenAt);
  const newestPm = motors.filter((m) => m.lot.productCode === 'PM-150')
    .sort((a, b) => b.attempts[0].startedAt.getTime() - a.attempts[0].startedAt.getTime()).slice(0, rawDataMotors);
  const rawData = {
    blobs: options.blobs,
    serials: new Set([...newestPm.map((m) => m.serial), ...damagedMagnetSerials, demoSerials.swappedSequence]),
  };
  const baselineRuns = await ingestPlannedRuns(db, baseline, rawData);
  await freezeKeControlLimits(db, clock);
  const liveRuns = await ingestPlannedRuns(db, motors.filter((m) => m.attempts[0].startedAt >= frozenAt), rawData);
  const runs = baselineRuns + liveRuns;
  return { motors: motors.length, runs, elapsedMs: Date.now() - startedMs };
}
