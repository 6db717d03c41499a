import type { Knex } from 'knex';
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

/** The waveform summaries and raw readings of one run, inside the run's ingest transaction. */
export async function storeWaveformsAndReadings(trx: Knex.Transaction, runId: number, kept: KeptRawData): Promise<void> {
  if (kept.waveforms.length > 0) {
    await trx('waveforms').insert(kept.waveforms.map((w) => ({
      run_id: runId, kind: w.kind, sample_rate_hz: w.sampleRateHz, speed_rpm: w.speedRpm,
      samples_per_channel: w.samplesPerChannel, blob_sha256: w.blobSha256, summary_json: JSON.stringify(w.summary),
    })));
  }
  if (kept.readings.length > 0) {
    await trx('raw_readings').insert(kept.readings.map(({ kind, ...reading }) => ({
      run_id: runId, kind, reading_json: JSON.stringify(reading),
    })));
  }
}
