import type { Knex } from 'knex';
import { capability } from '../../analysis/spc/index.js';
import { notFound } from '../../errors.js';
import { readValues, runRangeOf } from './series.js';
import { characteristicFacts, specLimitsOf } from './spec-limits.js';

const bins = 30;

function histogram(values: readonly number[]) {
  let min = Infinity;
  let max = -Infinity;
  for (const v of values) { if (v < min) min = v; if (v > max) max = v; }
  const width = (max - min) / bins || 1;
  const counts = new Array<number>(bins).fill(0);
  for (const v of values) counts[Math.min(bins - 1, Math.floor((v - min) / width))] += 1;
  return counts.map((count, i) => ({ from: min + i * width, to: min + (i + 1) * width, count }));
}

/**
 * Capability of every value in the window (AIAG: Cp/Cpk with σ within, Pp/Ppk with σ overall),
 * the histogram and the fitted normal curve scaled to counts. The study says "not normal" below
 * p = 0.05 (Anderson–Darling), where the normal-model indices and ppm should not be trusted.
 */
export async function capabilityView(db: Knex, characteristicId: number, window: { from?: Date; to?: Date }) {
  const facts = await characteristicFacts(db, characteristicId);
  if (!facts) throw notFound(`No characteristic ${characteristicId}.`);
  const [spec, values] = await Promise.all([specLimitsOf(db, characteristicId), runRangeOf(db, window).then((range) => readValues(db, characteristicId, range))]);
  const numbers = values.map((v) => v.value);
  if (!spec || (spec.lsl === null && spec.usl === null)) return { spec, n: numbers.length, study: null, reason: 'no specification limits are approved for this characteristic' };
  if (numbers.length < 3) return { spec, n: numbers.length, study: null, reason: 'fewer than 3 values in the window' };
  let study;
  try {
    study = capability(numbers, { lsl: spec.lsl, usl: spec.usl });
  } catch (error) {
    return { spec, n: numbers.length, study: null, reason: (error as Error).message };
  }
  const bars = histogram(numbers);
  const width = bars[0].to - bars[0].from;
  const curve = bars.map((bar) => {
    const x = (bar.from + bar.to) / 2;
    const density = Math.exp(-0.5 * ((x - study.mean) / study.sigmaOverall) ** 2) / (study.sigmaOverall * Math.sqrt(2 * Math.PI));
    return { x, count: density * width * numbers.length };
  });
  return { spec, n: numbers.length, study, normal: study.normality.pValue >= 0.05, histogram: bars, curve, reason: null };
}
