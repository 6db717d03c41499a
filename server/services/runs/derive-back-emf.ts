import { analyzeBackEmf, resolverOffset, type BackEmfAnalysis, type ResolverOffset } from '../../analysis/index.js';
import { AppError } from '../../errors.js';
import type { BackEmfWaveformInput } from '../../schemas/raw-data.js';
import { encodeChannels } from '../waveforms/sample-bytes.js';
import type { DerivedResults } from './derived-result.js';
import type { ProductRef } from './reference-data.js';

/** Documented limit: 500k samples per channel (3 × 500k line voltages, plus the resolver). */
export const MAX_SAMPLES_PER_CHANNEL = 500_000;

export type BackEmfSummary = BackEmfAnalysis & { resolver: (ResolverOffset & { resolverPolePairs: number }) | null };

/** A waveform ready to keep: its row in `waveforms` and the canonical bytes for the blob store. */
export type PreparedWaveform = {
  kind: 'back-emf'; sampleRateHz: number; speedRpm: number; samplesPerChannel: number;
  summary: BackEmfSummary; bytes: Buffer;
};

/** Refuses an oversized waveform before any analysis: 413, naming the channel. */
export function requireWaveformSize(waveform: BackEmfWaveformInput, field: string): void {
  const channels = { ...waveform.lineToLineV, ...(waveform.resolverAngleDeg ? { resolverAngleDeg: waveform.resolverAngleDeg } : {}) };
  for (const [name, samples] of Object.entries(channels)) {
    if (samples.length > MAX_SAMPLES_PER_CHANNEL) {
      const path = name === 'resolverAngleDeg' ? `${field}.resolverAngleDeg` : `${field}.lineToLineV.${name}`;
      const message = `holds ${samples.length} samples; a waveform may hold at most ${MAX_SAMPLES_PER_CHANNEL} per channel`;
      throw new AppError(413, 'payload_too_large', `${path} ${message}. Nothing was stored.`, [{ field: path, message }]);
    }
  }
}

/**
 * Back-EMF characteristics of one spin: Ke, worst-line THD, unbalance, electrical frequency
 * referred to 1000 rpm (so one limit holds at any spin speed), phase sequence (+1 U-V-W,
 * −1 reversed), the worst phase spacing's deviation from 120° and, with a resolver channel, the
 * resolver offset. The analyses are server/analysis/waveform's; this only maps them to codes.
 */
export function deriveBackEmf(product: ProductRef, waveform: BackEmfWaveformInput, field: string, derived: DerivedResults): PreparedWaveform | null {
  if (product.motorKind !== 'pmsm') {
    derived.fields.push({ field: `${field}.kind`, message: `a back-EMF waveform needs a permanent-magnet motor; ${product.code} is ${product.motorKind}` });
    return null;
  }
  let prepared: PreparedWaveform | null = null;
  derived.attempt(field, () => {
    const { sampleRateHz, speedRpm, lineToLineV, resolverAngleDeg } = waveform;
    const analysis = analyzeBackEmf({ sampleRateHz, speedRpm, polePairs: product.polePairs, lineToLineV });
    const resolver = resolverAngleDeg ? offsetOf(product, waveform, resolverAngleDeg) : null;
    const spacings = Object.values(analysis.phaseSpacingDeg);
    derived.add('ke', analysis.keVPerKrpm, field);
    derived.add('emf_frequency', (analysis.electricalHz * 1000) / speedRpm, field);
    derived.add('emf_thd', Math.max(...Object.values(analysis.thdPercent)), field);
    derived.add('emf_unbalance', analysis.unbalancePercent, field);
    derived.add('phase_sequence', analysis.sequence === 'UVW' ? 1 : -1, field);
    derived.add('phase_spacing_dev', Math.max(...spacings.map((deg) => Math.abs(deg - 120))), field);
    if (resolver) derived.add('resolver_offset', resolver.offsetDeg, `${field}.resolverAngleDeg`);
    const channels = [lineToLineV.uv, lineToLineV.vw, lineToLineV.wu, ...(resolverAngleDeg ? [resolverAngleDeg] : [])];
    prepared = {
      kind: 'back-emf', sampleRateHz, speedRpm, samplesPerChannel: lineToLineV.uv.length,
      summary: { ...analysis, resolver }, bytes: encodeChannels(channels),
    };
  });
  return prepared;
}

function offsetOf(product: ProductRef, waveform: BackEmfWaveformInput, resolverAngleDeg: number[]): BackEmfSummary['resolver'] {
  if (product.resolverPolePairs === null) {
    throw new Error(`resolverAngleDeg was sent, but product ${product.code} declares no resolver`);
  }
  const offset = resolverOffset({
    sampleRateHz: waveform.sampleRateHz, polePairs: product.polePairs, resolverPolePairs: product.resolverPolePairs,
    backEmfUvV: waveform.lineToLineV.uv, resolverAngleDeg,
  });
  return { ...offset, resolverPolePairs: product.resolverPolePairs };
}
