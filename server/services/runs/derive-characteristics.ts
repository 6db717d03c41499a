import type { ResultInput } from '../../schemas/test-run.js';
import type { ProductRef } from './reference-data.js';

export type DerivationInput = {
  product: ProductRef;
  waveforms: ReadonlyArray<Record<string, unknown>>;
  readings: ReadonlyArray<Record<string, unknown>>;
};

/**
 * The hook where Fluxtrail computes characteristics itself from the raw data a stand may send
 * with a run (back-EMF and resolver waveforms, insulation and winding-resistance readings), so
 * that Ke, THD, resolver offset or temperature-corrected values are computed one way for every
 * stand. The analysis functions are not wired in yet, so for now every run derives nothing; the
 * raw data is still covered by the stored body hash, so a retry with different raw data is a 409.
 * The results it returns are judged and stored exactly like the stand's own results.
 */
export function deriveCharacteristics(_input: DerivationInput): ResultInput[] {
  return [];
}
