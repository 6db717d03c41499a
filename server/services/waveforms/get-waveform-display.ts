import type { Knex } from 'knex';
import { BlobNotFoundError, type BlobStore } from '../../blob-store/blob-store.js';
import { HIGHEST_HARMONIC } from '../../analysis/index.js';
import { notFound } from '../../errors.js';
import { jsonColumn } from '../../db/json-column.js';
import { BACK_EMF_CHANNELS, decodeChannels } from './sample-bytes.js';
import { MAX_DISPLAY_POINTS, minMaxEnvelope } from './display-samples.js';

type Line = 'uv' | 'vw' | 'wu';
const LINES: readonly Line[] = ['uv', 'vw', 'wu'];

export type WaveformDisplay = {
  kind: string; sampleRateHz: number; speedRpm: number; samplesPerChannel: number; blobSha256: string;
  /** True when the points below are a min/max envelope rather than every sample. */
  downsampled: boolean;
  lineToLineV: Record<Line, Array<[number, number]>>;
  /** Harmonic orders 2…25 in percent of each line's fundamental, from the stored analysis. */
  spectrum: Array<{ order: number } & Record<Line, number>>;
  summary: unknown;
};

/**
 * One waveform of one run of one motor, for the Motor record's chart: the stored summary, the
 * harmonic spectrum and the samples down-sampled for display. 404 when the serial, run or kind
 * does not match, or when the blob store no longer holds the samples.
 */
export async function getWaveformDisplay(db: Knex, blobs: BlobStore, where: { serial: string; runId: string; kind: string }): Promise<WaveformDisplay> {
  const row = await db('waveforms')
    .join('test_runs', 'test_runs.id', 'waveforms.run_id')
    .join('motors', 'motors.id', 'test_runs.motor_id')
    .where({ 'motors.serial': where.serial, 'test_runs.run_uuid': where.runId, 'waveforms.kind': where.kind })
    .first('waveforms.kind', 'waveforms.sample_rate_hz', 'waveforms.speed_rpm', 'waveforms.samples_per_channel', 'waveforms.blob_sha256', 'waveforms.summary_json');
  if (!row) throw notFound(`Run ${where.runId} of motor ${where.serial} has no ${where.kind} waveform.`);
  const bytes = await blobs.get(row.blob_sha256).catch((error: unknown) => {
    throw error instanceof BlobNotFoundError ? notFound(`The raw samples of this ${where.kind} waveform (${row.blob_sha256}) are not in the blob store.`) : error;
  });
  const channels = decodeChannels(bytes, row.samples_per_channel);
  const summary = jsonColumn<{ harmonicsPercent?: Record<Line, Record<string, number>> }>(row.summary_json);
  const envelope = (line: Line) => minMaxEnvelope(channels[BACK_EMF_CHANNELS.indexOf(line)], row.sample_rate_hz);
  return {
    kind: row.kind, sampleRateHz: row.sample_rate_hz, speedRpm: row.speed_rpm, samplesPerChannel: row.samples_per_channel,
    blobSha256: row.blob_sha256, downsampled: row.samples_per_channel > MAX_DISPLAY_POINTS,
    lineToLineV: { uv: envelope('uv'), vw: envelope('vw'), wu: envelope('wu') },
    spectrum: spectrumOf(summary.harmonicsPercent),
    summary,
  };
}

function spectrumOf(harmonics: Record<Line, Record<string, number>> | undefined): WaveformDisplay['spectrum'] {
  if (!harmonics) return [];
  return Array.from({ length: HIGHEST_HARMONIC - 1 }, (_, i) => {
    const order = i + 2;
    const entry = { order, uv: 0, vw: 0, wu: 0 };
    for (const line of LINES) entry[line] = harmonics[line]?.[String(order)] ?? 0;
    return entry;
  });
}
