import { describe, expect, it } from 'vitest';
import { demoRawData } from '../../../seeds/demo/waveforms.js';
import { createPrng } from '../../../seeds/demo/prng.js';
import { deriveCharacteristics } from '../../../server/services/runs/derive-characteristics.js';
import type { ProductRef } from '../../../server/services/runs/reference-data.js';

// A damaged-magnet, swapped-lead PM-150 run as its motor model would post it.
const simulated = {
  winding_temp: 23.4, r_u_20c: 9.81, r_v_20c: 9.79, r_w_20c: 9.8, r_unbalance: 0.102, ir_40c: 2500, dar: 1.45,
  hipot_voltage: 2040, hipot_leakage: 1.9, ke: 48.3, emf_frequency: 66.66, emf_thd: 1.5, emf_unbalance: 3.1,
  phase_sequence: -1, phase_spacing_dev: 120, resolver_offset: 12.4, noise: 71.2,
};
const unitOf = (code: string) => (/^r_[uvw]_20c$/.test(code) ? 'mΩ' : 'any');
const results = Object.entries(simulated).map(([characteristic, value]) => ({ characteristic, value, unit: unitOf(characteristic) }));
const product: ProductRef = {
  id: 1, code: 'PM-150', name: 'PM-150', motorKind: 'pmsm', serialPattern: /^PM150-\d{6}$/, serialPatternText: '',
  polePairs: 4, resolverPolePairs: 4, windingMaterial: 'copper',
  characteristics: new Map(results.map((r, i) => [r.characteristic, { id: i, code: r.characteristic, name: r.characteristic, unit: r.unit, testStep: '', derived: true, sortOrder: i }])),
};

describe('demo raw data for PM-150 runs', () => {
  it('when Fluxtrail derives the characteristics from the generated raw data, then it gets the simulated values back', () => {
    const raw = demoRawData(results, createPrng(20_261_201));
    expect(raw.waveforms[0].lineToLineV.uv).toHaveLength(4096);
    const derived = deriveCharacteristics({ product, waveforms: raw.waveforms, readings: raw.readings, posted: raw.results });
    expect(derived.fields).toEqual([]);
    const back = Object.fromEntries(derived.results.map((r) => [r.characteristic, r.value]));
    // Tolerances: the generator adds probe noise (0.08 V RMS) and 12-bit resolver quantisation.
    expect(back.ke).toBeCloseTo(simulated.ke, 1);
    expect(back.emf_frequency).toBeCloseTo(simulated.emf_frequency, 2);
    expect(back.emf_thd).toBeCloseTo(simulated.emf_thd, 1);
    expect(back.emf_unbalance).toBeCloseTo(simulated.emf_unbalance, 1);
    expect(back.phase_sequence).toBe(-1);
    expect(back.resolver_offset).toBeCloseTo(simulated.resolver_offset, 1);
    expect(back.ir_40c).toBeCloseTo(simulated.ir_40c, -1);
    expect(back.dar).toBeCloseTo(simulated.dar, 2);
    expect(back.r_u_20c).toBeCloseTo(simulated.r_u_20c, 3);
  });

  it('when raw data is built, then the posted results keep only what cannot be derived from it', () => {
    const raw = demoRawData(results, createPrng(1));
    expect(raw.results.map((r) => r.characteristic)).toEqual(['winding_temp', 'hipot_voltage', 'hipot_leakage', 'noise']);
  });
});
