import type { Knex } from 'knex';
import { ingestTestRun } from '../../server/services/runs/ingest-test-run.js';
import type { TestRunDocument } from '../../server/schemas/test-run.js';
import type { BlobStore } from '../../server/blob-store/blob-store.js';
import { simulateMotor } from './generate-values.js';
import type { PlannedMotor } from './plan-motors.js';
import { demoRawData } from './waveforms.js';

/** Which motors post raw data (waveform and readings) instead of summary values, and where samples go. */
export type RawDataPlan = { serials: ReadonlySet<string>; blobs: BlobStore };

/** A stand's upload reaches the server a couple of seconds after the run ends. */
const transmitMs = 2_000;

/**
 * Posts every planned run through the real ingest service, motor by motor in order of first test,
 * with a few motors in flight at once. A motor's runs go one after the other and stop at a pass,
 * so attempts, verdicts, limit revisions, motor status and calibration holds are the server's own.
 */
export async function ingestPlannedRuns(db: Knex, motors: readonly PlannedMotor[], rawData: RawDataPlan, concurrency = 8): Promise<number> {
  const queue = [...motors].sort((a, b) => a.attempts[0].startedAt.getTime() - b.attempts[0].startedAt.getTime());
  let next = 0;
  let runs = 0;
  const worker = async () => {
    while (next < queue.length) {
      const motorRuns = await ingestMotor(db, queue[next++], rawData);
      runs += motorRuns;
    }
  };
  await Promise.all(Array.from({ length: concurrency }, worker));
  return runs;
}

async function ingestMotor(db: Knex, motor: PlannedMotor, rawData: RawDataPlan): Promise<number> {
  const simulated = simulateMotor(motor.lot.productCode, motor.context);
  const postsRawData = rawData.serials.has(motor.serial);
  let runs = 0;
  for (const attempt of motor.attempts) {
    const results = simulated.measure(new Set(attempt.faults));
    const raw = postsRawData ? demoRawData(results, motor.context.prng) : { results };
    const document: TestRunDocument = {
      runId: motor.context.prng.uuid(), serial: motor.serial, product: motor.lot.productCode,
      station: attempt.stationCode, lot: motor.lot.code,
      startedAt: attempt.startedAt.toISOString(), finishedAt: attempt.finishedAt.toISOString(),
      operatorBadge: attempt.operatorBadge, programVersion: attempt.programVersion,
      ...raw,
    };
    const outcome = await ingestTestRun(db, document, { now: new Date(attempt.finishedAt.getTime() + transmitMs), blobs: rawData.blobs });
    runs += 1;
    if (outcome.body.verdict === 'pass') break;
  }
  return runs;
}
