import type { Knex } from 'knex';
import { AppError, invalid, notFound, type FieldError } from '../../errors.js';
import type { TestRunDocument } from '../../schemas/test-run.js';
import { loadLot, loadProduct } from './reference-data.js';
import { limitsInForce } from './limits-in-force.js';
import { cachedStationOfClient, stationByCode, type StationRef } from './station-of-client.js';
import { checkSerialAndLot, checkTimes } from './check-run-document.js';
import { checkResults, judgeRun, type LabelledResult } from './judge-run.js';
import { deriveCharacteristics } from './derive-characteristics.js';
import { keepRawSamples } from './store-waveforms-and-readings.js';
import type { BlobStore } from '../../blob-store/blob-store.js';
import { bodySha256, type IngestOutcome } from './stored-run.js';
import { storeCheckedRun } from './run-writer.js';
import type { RunToStore } from './store-runs.js';

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
 * field), judges the results against the limit revision in force at startedAt, then hands the run
 * to the writer, which counts the attempt under the motor's row lock, writes run and measurements,
 * keeps the motor's status, SPC and yield current and holds the motor when the station's
 * calibration had expired (store-runs.ts). Idempotent per runId.
 */
export async function ingestTestRun(db: Knex, document: TestRunDocument, options: IngestOptions = {}): Promise<IngestOutcome> {
  return storeCheckedRun(db, await checkRun(db, document, options));
}

/** Every check of a posted run, and its verdicts: what is left is to store it (run-writer.ts). */
export async function checkRun(db: Knex, document: TestRunDocument, options: IngestOptions = {}): Promise<RunToStore> {
  const now = options.now ?? new Date();
  const sha256 = bodySha256(document);
  // Independent reads in parallel: ingest latency is mostly round trips. A retry is not looked
  // for here: it passes the same checks and is caught by the unique runId when stored.
  const [station, product, lot] = await Promise.all([
    findStation(db, document, options.clientId), loadProduct(db, document.product), loadLot(db, document.lot),
  ]);

  const fields: FieldError[] = [...checkTimes(document, now)];
  if (!station) fields.push({ field: 'station', message: `station ${document.station} is not known` });
  if (!product) throw invalid([...fields, { field: 'product', message: `product ${document.product} is not known` }]);
  const limitSet = await limitsInForce(db, product.id, new Date(document.startedAt));
  fields.push(...checkSerialAndLot(document, product, lot));
  const derived = deriveCharacteristics({ product, waveforms: document.waveforms ?? [], readings: document.readings ?? [], posted: document.results });
  const labelled: LabelledResult[] = [
    ...document.results.map((result, i) => ({ result, field: `results[${i}]` })),
    ...derived.results.map((result, i) => ({ result, field: `derived[${i}]` })),
  ];
  fields.push(...derived.fields, ...checkResults(labelled, product));
  if (!limitSet) fields.push({ field: 'startedAt', message: `no approved limit revision of ${product.code} was in force at ${document.startedAt}` });
  if (fields.length > 0 || !station || !lot || !limitSet) throw invalid(fields);

  const results = labelled.map((l) => l.result);
  const judged = judgeRun(results, product, limitSet.limits);
  const raw = await keepRawSamples(options.blobs, derived);
  return { document, sha256, station, product, lotId: lot.id, results, limitSet, judged, raw, source: options.source ?? 'station', receivedAt: now };
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
