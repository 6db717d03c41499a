import type { Knex } from 'knex';
import type { Statement } from '../../db/statements.js';
import type { BlobStore } from '../../blob-store/blob-store.js';
import type { ReadingInput } from '../../schemas/raw-data.js';
import type { PreparedWaveform } from './derive-back-emf.js';

/** What a run keeps of its raw data once the samples are in the blob store. */
export type KeptRawData = {
  waveforms: Array<Omit<PreparedWaveform, 'bytes'> & { blobSha256: string }>;
  readings: ReadingInput[];
};

/**
 * Writes the raw samples to the blob store; called after every check and before the run's
 * transaction, so no database lock waits on compression and disk. If the transaction then fails,
 * the blob is an orphan that does no harm: it is keyed by its content, and a retry of the same
 * run writes the same key.
 */
export async function keepRawSamples(blobs: BlobStore | undefined, raw: { waveforms: PreparedWaveform[]; readings: ReadingInput[] }): Promise<KeptRawData> {
  const waveforms = [];
  for (const { bytes, ...waveform } of raw.waveforms) {
    if (!blobs) throw new Error('ingest needs a blob store to keep waveform samples');
    waveforms.push({ ...waveform, blobSha256: await blobs.put(bytes) });
  }
  return { waveforms, readings: raw.readings };
}

/** The statements that store the waveform summaries and raw readings of one run (none when it has none). */
export function waveformsAndReadingsStatements(db: Knex, runId: number, kept: KeptRawData): Statement[] {
  const statements: Statement[] = [];
  if (kept.waveforms.length > 0) {
    statements.push(db('waveforms').insert(kept.waveforms.map((w) => ({
      run_id: runId, kind: w.kind, sample_rate_hz: w.sampleRateHz, speed_rpm: w.speedRpm,
      samples_per_channel: w.samplesPerChannel, blob_sha256: w.blobSha256, summary_json: JSON.stringify(w.summary),
    }))).toSQL());
  }
  if (kept.readings.length > 0) {
    statements.push(db('raw_readings').insert(kept.readings.map(({ kind, ...reading }) => ({
      run_id: runId, kind, reading_json: JSON.stringify(reading),
    }))).toSQL());
  }
  return statements;
}
