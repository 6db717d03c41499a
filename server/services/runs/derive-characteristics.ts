import type { FieldError } from '../../errors.js';
import type { ReadingInput } from '../../schemas/raw-data.js';
import type { ResultInput, TestRunDocument } from '../../schemas/test-run.js';
import { deriveBackEmf, requireWaveformSize, type PreparedWaveform } from './derive-back-emf.js';
import { deriveInsulation, deriveWindingResistance } from './derive-readings.js';
import { DerivedResults } from './derived-result.js';
import type { ProductRef } from './reference-data.js';

export type DerivationInput = {
  product: ProductRef;
  waveforms: NonNullable<TestRunDocument['waveforms']>;
  readings: NonNullable<TestRunDocument['readings']>;
  /** The stand's own results, to refuse a second value for a characteristic derived here. */
  posted: readonly ResultInput[];
};

export type Derivation = {
  results: ResultInput[];
  fields: FieldError[];
  waveforms: PreparedWaveform[];
  readings: ReadingInput[];
};

/**
 * Fluxtrail computes characteristics itself from the raw data a stand sends with a run, so Ke,
 * THD, resolver offset and temperature-corrected values are computed one way for every stand.
 * The derived results are judged and stored exactly like the stand's own; each goes to the
 * product's characteristic of the same code, and a product without that code gets none.
 *
 * Conflict rule: a run must not carry two values for one characteristic, so a posted result
 * for a code that this run's raw data derives is refused (422 naming the posted result). A stand
 * that computes its own summary posts the values and no raw data for them.
 * An oversized waveform throws 413 before anything is analysed.
 */
export function deriveCharacteristics(input: DerivationInput): Derivation {
  const { product, waveforms, readings } = input;
  waveforms.forEach((waveform, i) => requireWaveformSize(waveform, `waveforms[${i}]`));
  const derived = new DerivedResults(product);
  const prepared = waveforms.flatMap((waveform, i) => deriveBackEmf(product, waveform, `waveforms[${i}]`, derived) ?? []);
  readings.forEach((reading, i) => {
    const field = `readings[${i}]`;
    if (reading.kind === 'insulation') deriveInsulation(reading, field, derived);
    else if (reading.kind === 'winding-resistance') deriveWindingResistance(product, reading, field, derived);
    // Hipot readings are kept as records; its characteristics are the stand's own results.
  });
  return {
    results: derived.results.map((d) => d.result),
    fields: [...derived.fields, ...conflicts(input.posted, derived)],
    waveforms: prepared,
    readings: [...readings],
  };
}

function conflicts(posted: readonly ResultInput[], derived: DerivedResults): FieldError[] {
  const sourceOf = new Map(derived.results.map((d) => [d.result.characteristic, d.source]));
  return posted.flatMap((result, i) => {
    const source = sourceOf.get(result.characteristic);
    return source === undefined ? [] : [{
      field: `results[${i}].characteristic`,
      message: `${result.characteristic} is derived by Fluxtrail from ${source} of this run; post either the raw data or the value, not both`,
    }];
  });
}
