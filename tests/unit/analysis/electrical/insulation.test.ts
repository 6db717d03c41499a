import { describe, expect, it } from 'vitest';
import {
  dielectricAbsorptionRatio,
  insulationResistanceAt40C,
  minimumInsulationResistanceLegacyMegohm,
  minimumInsulationResistanceMegohm,
  polarizationIndex,
  polarizationIndexMeaningful,
  polarizationIndexMinimum,
} from '../../../../server/analysis/electrical/index.js';

describe('insulationResistanceAt40C', () => {
  it('when 200 MΩ is read at 20 °C, then it corrects to 50 MΩ at 40 °C', () => {
    // IEEE Std 43-2013 §6.3: K_T = 0.5^((40 − 20)/10) = 0.25
    expect(insulationResistanceAt40C({ resistanceMegohm: 200, windingTempC: 20 })).toBeCloseTo(50, 10);
  });

  it('when read at 70 °C, then the reading is multiplied by 8', () => {
    // IEEE Std 43-2013 §6.3: K_T = 0.5^(−3) = 8 (IR halves per 10 °C rise)
    expect(insulationResistanceAt40C({ resistanceMegohm: 3, windingTempC: 70 })).toBeCloseTo(24, 10);
  });

  it('when two readings of one winding follow the published halving table, then both correct to the same R₄₀', () => {
    // UEI DMEG3 megohmmeter manual, temperature-correction table: 150 MΩ at 20 °C reads 75 MΩ at
    // 30 °C (factor 2 per 10 °C, the rule IEEE Std 43 uses); both must give one R₄₀ = 37.5 MΩ
    const at20 = insulationResistanceAt40C({ resistanceMegohm: 150, windingTempC: 20 });
    const at30 = insulationResistanceAt40C({ resistanceMegohm: 75, windingTempC: 30 });
    expect(at20).toBeCloseTo(37.5, 10);
    expect(at30).toBeCloseTo(at20, 10);
  });

  it('when the resistance is negative, then it throws naming resistanceMegohm', () => {
    expect(() => insulationResistanceAt40C({ resistanceMegohm: -1, windingTempC: 20 })).toThrow(/resistanceMegohm.*negative/);
  });

  it('when the temperature is outside −40…200 °C or not finite, then it throws naming windingTempC', () => {
    expect(() => insulationResistanceAt40C({ resistanceMegohm: 100, windingTempC: -41 })).toThrow(/windingTempC.*between/);
    expect(() => insulationResistanceAt40C({ resistanceMegohm: 100, windingTempC: 201 })).toThrow(/windingTempC.*between/);
    expect(() => insulationResistanceAt40C({ resistanceMegohm: 100, windingTempC: Number.NaN })).toThrow(/windingTempC.*finite/);
  });
});

describe('polarizationIndex and dielectricAbsorptionRatio', () => {
  it('when R10 = 5000 MΩ and R1 = 2000 MΩ, then PI = 2.5', () => {
    // IEEE Std 43-2013 §5.4: PI = R10min / R1min
    expect(polarizationIndex({ r1MinMegohm: 2000, r10MinMegohm: 5000 })).toBeCloseTo(2.5, 12);
  });

  it('when R60 = 150 MΩ and R30 = 100 MΩ, then DAR = 1.5', () => {
    // DAR = R60s / R30s (common practice; no IEEE 43 minimum)
    expect(dielectricAbsorptionRatio({ r30sMegohm: 100, r60sMegohm: 150 })).toBeCloseTo(1.5, 12);
  });

  it('when the first reading is zero, then it throws naming it instead of dividing by zero', () => {
    expect(() => polarizationIndex({ r1MinMegohm: 0, r10MinMegohm: 10 })).toThrow(/r1MinMegohm/);
    expect(() => dielectricAbsorptionRatio({ r30sMegohm: 0, r60sMegohm: 10 })).toThrow(/r30sMegohm/);
  });

  it('when the insulation class is A, then the PI minimum is 1.5; for B, F and H it is 2.0', () => {
    // IEEE Std 43-2000/2013 PI minimums, as reprinted in the Hioki 3455 manual, Appendix 3
    expect(polarizationIndexMinimum('A')).toBe(1.5);
    expect(polarizationIndexMinimum('B')).toBe(2.0);
    expect(polarizationIndexMinimum('F')).toBe(2.0);
    expect(polarizationIndexMinimum('H')).toBe(2.0);
  });

  it('when the class is unknown, then it throws naming insulationClass', () => {
    expect(() => polarizationIndexMinimum('C' as 'A')).toThrow(/insulationClass/);
  });

  it('when R1 is above 5000 MΩ, then the PI is not meaningful; at 5000 MΩ it still is', () => {
    // IEEE Std 43-2013: PI may be disregarded when the 1-min IR exceeds 5000 MΩ
    expect(polarizationIndexMeaningful(5001)).toBe(false);
    expect(polarizationIndexMeaningful(5000)).toBe(true);
    expect(polarizationIndexMeaningful(300)).toBe(true);
  });
});

describe('minimum insulation resistance', () => {
  it('when a form-wound winding is rated 1 kV or more, then the minimum is 100 MΩ', () => {
    // IEEE Std 43-2013 §12.3 recommended minimum IR at 40 °C: form-wound after 1970 → 100 MΩ
    expect(minimumInsulationResistanceMegohm({ ratedVoltageV: 6600, winding: 'form' })).toBe(100);
    expect(minimumInsulationResistanceMegohm({ ratedVoltageV: 1000, winding: 'form' })).toBe(100);
  });

  it('when the winding is random-wound, or form-wound below 1 kV, then the minimum is 5 MΩ', () => {
    // IEEE Std 43-2013 §12.3: random-wound and form-wound below 1 kV → 5 MΩ
    expect(minimumInsulationResistanceMegohm({ ratedVoltageV: 400, winding: 'random' })).toBe(5);
    expect(minimumInsulationResistanceMegohm({ ratedVoltageV: 4160, winding: 'random' })).toBe(5);
    expect(minimumInsulationResistanceMegohm({ ratedVoltageV: 690, winding: 'form' })).toBe(5);
  });

  it('when a pre-1970 winding is rated 4.16 kV, then the legacy minimum is 5.16 MΩ', () => {
    // IEEE Std 43-2013 §12.3: kV + 1 MΩ for most windings made before about 1970
    expect(minimumInsulationResistanceLegacyMegohm(4160)).toBeCloseTo(5.16, 12);
  });

  it('when the rated voltage is not positive or the winding kind is unknown, then it throws naming the argument', () => {
    expect(() => minimumInsulationResistanceMegohm({ ratedVoltageV: 0, winding: 'form' })).toThrow(/ratedVoltageV/);
    expect(() => minimumInsulationResistanceMegohm({ ratedVoltageV: 400, winding: 'wave' as 'form' })).toThrow(/winding/);
    expect(() => minimumInsulationResistanceLegacyMegohm(-400)).toThrow(/ratedVoltageV/);
  });
});
