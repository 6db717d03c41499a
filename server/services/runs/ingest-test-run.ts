import type { Knex } from 'knex';
import { AppError, invalid, notFound, type FieldError } from '../../errors.js';
import type { TestRunDocument, TestRunResponse } from '../../schemas/test-run.js';
import { statusAfterRun } from '../motors/refresh-motor-status.js';
import { placeHold } from '../holds/place-hold.js';
import { loadLot, loadProduct } from './reference-data.js';
import { limitsInForce } from './limits-in-force.js';
import { cachedStationOfClient, stationByCode, type StationRef } from './station-of-client.js';
import { checkSerialAndLot, checkTimes } from './check-run-document.js';
import { checkResults, judgeRun, type LabelledResult } from './judge-run.js';
import { deriveCharacteristics } from './derive-characteristics.js';
import { keepRawSamples, storeWaveformsAndReadings, type KeptRawData } from './store-waveforms-and-readings.js';
import type { BlobStore } from '../../blob-store/blob-store.js';
import { answerForRetry, bodySha256, type IngestOutcome } from './stored-run.js';
import { evaluateSpcAfterIngest } from '../spc/evaluate-after-ingest.js';
import { updateYieldRollups } from '../yield/update-yield-rollups.js';

export type IngestOptions = {
  /** The OAuth2 client posting the run; its bound station must be the run's station. Omitted by seeds and uploads. */
  clientId?: string;
  source?: 'station' | 'upload';
  now?: Date;
  /** Where waveform samples are kept; needed only when a run carries waveforms. */
  blobs?: BlobStore;
};

/**
 * Stores one test run all-or-nothing: checks every reference and value (each fault named by its
 * field), judges the results against the limit revision in force at startedAt, counts the attempt
 * under the motor's row lock, writes run and measurements, keeps the motor's status current and
 * holds the motor when the station's calibration had expired. Idempotent per runId.
 */
export async function ingestTestRun(db: Knex, document: TestRunDocument, options: IngestOptions = {}): Promise<IngestOutcome> {
  const now = options.now ?? new Date();
  const sha256 = bodySha256(document);
  // Independent reads in parallel: ingest latency is mostly round trips. A retry is not looked
  // for here: it passes the same checks and is caught by the unique runId when stored.
  const [station, product, lot, limitSet] = await Promise.all([
    findStation(db, document, options.clientId), loadProduct(db, document.product), loadLot(db, document.lot),
    limitsInForce(db, { code: document.product }, new Date(document.startedAt)),
  ]);

  const fields: FieldError[] = [...checkTimes(document, now)];
  if (!station) fields.push({ field: 'station', message: `station ${document.station} is not known` });
  if (!product) throw invalid([...fields, { field: 'product', message: `product ${document.product} is not known` }]);
  fields.push(...checkSerialAndLot(document, product, lot));
  const derived = deriveCharacteristics({ product, waveforms: document.waveforms ?? [], readings: document.readings ?? [], posted: document.results });
  const labelled: LabelledResult[] = [
    ...document.results.map((result, i) => ({ result, field: `results[${i}]` })),
    ...derived.results.map((result, i) => ({ result, field: `derived[${i}]` })),
  ];
  fields.push(...derived.fields, ...checkResults(labelled, product));
  if (!limitSet) fields.push({ field: 'startedAt', message: `no approved limit revision of ${product.code} was in force at ${document.startedAt}` });
  if (fields.length > 0 || !station || !lot || !limitSet) throw invalid(fields);

  const judged = judgeRun(labelled.map((l) => l.result), product, limitSet.limits);
  const raw = await keepRawSamples(options.blobs, derived);
  const run = { document, sha256, station, productId: product.id, lotId: lot.id, limitSet, judged, raw, source: options.source ?? 'station' };
  for (let attempt = 1; ; attempt++) {
    try {
      return { status: 201, body: await db.transaction((trx) => storeRun(trx, run, now)) };
    } catch (error) {
      if (!isRetryable(error)) throw error;
      // This runId is stored already (a retry, perhaps concurrent), or a deadlock between two first runs.
      const answer = await answerForRetry(db, document.runId, sha256);
      if (answer) return answer;
      if (attempt >= 3) throw error;
    }
  }
}

async function findStation(db: Knex, document: TestRunDocument, clientId: string | undefined): Promise<StationRef | null> {
  if (clientId === undefined) return stationByCode(db, document.station);
  const bound = await cachedStationOfClient(db, clientId);
  if (!bound) throw notFound(`Client ${clientId} is bound to no station; an admin binds it in Setup.`);
  if (bound.code !== document.station) {
    throw new AppError(403, 'station_mismatch', `This client posts for station ${bound.code}, not ${document.station}.`, [{ field: 'station', message: `must be ${bound.code}, the station bound to this client` }]);
  }
  return bound;
}

type RunToStore = {
  document: TestRunDocument; sha256: string; station: StationRef; productId: number; lotId: number;
  limitSet: NonNullable<Awaited<ReturnType<typeof limitsInForce>>>; judged: ReturnType<typeof judgeRun>; raw: KeptRawData; source: 'station' | 'upload';
};

async function storeRun(trx: Knex.Transaction, run: RunToStore, now: Date): Promise<TestRunResponse> {
  const { document, station, judged } = run;
  const motor = await lockOrCreateMotor(trx, run, now);
  const attempt = motor.attempts + 1;
  // The calibration due date is a plant calendar date, so compare it with the stand's local date.
  const calibrationOk = station.calibrationDue >= document.startedAt.slice(0, 10);
  const response: TestRunResponse = {
    runId: document.runId, serial: document.serial, attempt, verdict: judged.verdict, limitRevision: run.limitSet.revision,
    results: judged.results.map(({ characteristicId: _id, ...result }) => result),
  };
  const [runId] = await trx('test_runs').insert({
    run_uuid: document.runId, motor_id: motor.id, station_id: station.id, lot_id: run.lotId, attempt,
    started_at: new Date(document.startedAt), finished_at: new Date(document.finishedAt),
    operator_badge: document.operatorBadge, program_version: document.programVersion,
    limit_set_id: run.limitSet.id, verdict: judged.verdict, calibration_ok: calibrationOk, calibration_due: station.calibrationDue,
    body_sha256: run.sha256, response_json: JSON.stringify(response), source: run.source, received_at: now,
  });
  await trx('measurements').insert(judged.results.map((r) => ({
    run_id: runId, characteristic_id: r.characteristicId, value: r.value, lsl: r.lsl, usl: r.usl, verdict: r.verdict,
  })));
  await storeWaveformsAndReadings(trx, Number(runId), run.raw);
  await trx('motors').where({ id: motor.id }).update({
    attempts: attempt, latest_run_id: runId, last_station_id: station.id, last_tested_at: new Date(document.finishedAt),
    status: statusAfterRun(trx, judged.verdict),
  });
  await evaluateSpcAfterIngest(trx, { runId: Number(runId), motorId: motor.id, lotId: run.lotId, productId: run.productId, startedAt: document.startedAt, measurements: judged.results }, now);
  await updateYieldRollups(trx, {
    motorId: motor.id, runId: Number(runId), attempt, startedAt: new Date(document.startedAt), verdict: judged.verdict,
    productId: run.productId, lotId: run.lotId, station, failingCharacteristicIds: judged.results.filter((r) => r.verdict === 'fail').map((r) => r.characteristicId),
  });
  if (!calibrationOk) {
    await placeHold(trx, {
      // A retest on an overdue stand keeps the hold already placed; the run itself records its calibration state.
      target: { type: 'motor', serial: document.serial }, kind: 'calibration', at: now, ifAlreadyHeld: 'keep',
      actor: { name: `station ${station.code}`, role: null },
      reason: `Tested on station ${station.code} on ${document.startedAt.slice(0, 10)}, after its calibration fell due on ${station.calibrationDue}; retest on a calibrated station or disposition the run.`,
    });
  }
  return response;
}

/**
 * The motor row, locked so that concurrent runs of one serial count attempts one after the other.
 * Most runs are a serial's first, so the insert comes first: one statement instead of two. A
 * duplicate serial fails only that statement, and the existing row is then locked and read.
 */
async function lockOrCreateMotor(trx: Knex.Transaction, run: RunToStore, now: Date): Promise<{ id: number; attempts: number }> {
  const { serial } = run.document;
  try {
    const [id] = await trx('motors').insert({ serial, product_id: run.productId, lot_id: run.lotId, status: 'not tested', attempts: 0, created_at: now });
    return { id: Number(id), attempts: 0 };
  } catch (error) {
    if (errorCode(error) !== 'ER_DUP_ENTRY') throw error;
  }
  const existing = await trx('motors').where({ serial }).forUpdate().first('id', 'product_id', 'lot_id', 'attempts');
  if (existing.product_id !== run.productId) throw invalid([{ field: 'serial', message: `serial ${serial} was built as another product` }]);
  if (existing.lot_id !== run.lotId) throw invalid([{ field: 'lot', message: `serial ${serial} belongs to another lot` }]);
  return existing;
}

function errorCode(error: unknown): string | undefined {
  return typeof error === 'object' && error !== null ? (error as { code?: string }).code : undefined;
}

/** The runId taken (by an earlier or concurrent post), or a deadlock between two runs of one serial. */
function isRetryable(error: unknown): boolean {
  const code = errorCode(error);
  return code === 'ER_DUP_ENTRY' || code === 'ER_LOCK_DEADLOCK';
}
