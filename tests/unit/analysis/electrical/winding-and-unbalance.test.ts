import { describe, expect, it } from 'vitest';
import { unbalancePercent, windingResistanceAt } from '../../../../server/analysis/electrical/index.js';

describe('windingResistanceAt', () => {
  it('when 0.1000 Ω copper is read at 20 °C, then it is 0.12157 Ω at 75 °C', () => {
    // IEC 60034-1 / IEC 60034-2-1, k = 235: 0.1 × 310/255 = 0.121569 Ω
    const r75 = windingResistanceAt({ resistanceOhm: 0.1, measuredTempC: 20, referenceTempC: 75, material: 'copper' });
    expect(r75).toBeCloseTo(0.12157, 5);
  });

  it('when the winding is aluminium, then k = 225 gives 0.1 × 300/245 Ω', () => {
    // IEC 60034-1 / IEC 60034-2-1, k = 225 for aluminium: 0.122449 Ω
    const r75 = windingResistanceAt({ resistanceOhm: 0.1, measuredTempC: 20, referenceTempC: 75, material: 'aluminium' });
    expect(r75).toBeCloseTo(0.122449, 6);
  });

  it('when copper is corrected with IEC k = 235, then it differs from IEEE Std 118 k = 234.5 in the 5th decimal', () => {
    // IEEE Std 118 with k = 234.5 would give 0.1 × 309.5/254.5 = 0.121611 Ω; IEC gives 0.121569 Ω
    const r75 = windingResistanceAt({ resistanceOhm: 0.1, measuredTempC: 20, referenceTempC: 75, material: 'copper' });
    expect(Math.abs(r75 - 0.121611)).toBeGreaterThan(3e-5);
  });

  it('when the reference is the measuring temperature, then the reading is unchanged', () => {
    // IEC 60034-1: (k + θ)/(k + θ) = 1
    expect(windingResistanceAt({ resistanceOhm: 1.234, measuredTempC: 25, referenceTempC: 25, material: 'copper' })).toBeCloseTo(1.234, 12);
  });

  it('when an argument is out of range, then it throws naming the argument', () => {
    const base = { resistanceOhm: 0.1, measuredTempC: 20, referenceTempC: 75, material: 'copper' as const };
    expect(() => windingResistanceAt({ ...base, resistanceOhm: -0.1 })).toThrow(/resistanceOhm.*negative/);
    expect(() => windingResistanceAt({ ...base, measuredTempC: -50 })).toThrow(/measuredTempC.*between/);
    expect(() => windingResistanceAt({ ...base, referenceTempC: 250 })).toThrow(/referenceTempC.*between/);
    expect(() => windingResistanceAt({ ...base, material: 'silver' as 'copper' })).toThrow(/material/);
  });
});

describe('unbalancePercent', () => {
  it('when line voltages are 462, 463 and 455 V, then the unbalance is 1.087 %', () => {
    // NEMA MG 1 definition; example quoted on eng-tips ("Sequence angles imbalance"): mean 460 V,
    // largest deviation 5 V → 100 × 5/460 = 1.087 % (published rounded to 1.1 %)
    expect(unbalancePercent([462, 463, 455])).toBeCloseTo(1.087, 3);
  });

  it('when voltages are 480, 476 and 472 V, then the unbalance is 0.84 %, not the 1.68 % of (max − min)/mean', () => {
    // NEMA MG 1 worked example in Industrial Monitor Direct, "Industrial Voltage Unbalance: NEMA
    // MG1 Limits": max deviation 4 V / 476 V = 0.84 %; the (max − min)/mean shortcut gives 1.68 %
    const percent = unbalancePercent([480, 476, 472]);
    expect(percent).toBeCloseTo(0.84, 2);
    expect(percent).not.toBeCloseTo((100 * (480 - 472)) / 476, 2);
  });

  it('when all phases are equal, then the unbalance is zero', () => {
    // NEMA MG 1: no deviation from the mean
    expect(unbalancePercent([0.1, 0.1, 0.1])).toBeCloseTo(0, 10);
  });

  it('when the readings are too few, negative, non-finite or all zero, then it throws', () => {
    expect(() => unbalancePercent([460])).toThrow(/values.*two/);
    expect(() => unbalancePercent([460, -460, 460])).toThrow(/values\[1\].*negative/);
    expect(() => unbalancePercent([460, Number.NaN, 460])).toThrow(/values\[1\].*finite/);
    expect(() => unbalancePercent([0, 0, 0])).toThrow(/values.*zero/);
  });
});
