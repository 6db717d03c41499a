import { describe, expect, it } from 'vitest';
import { barScale, displayUnit, formatLimits, isHighVoltageResult } from '../../../src/features/motors/components/limits';

describe('formatLimits', () => {
  it('when both limits exist, then it shows the span with the unit once', () => {
    expect(formatLimits({ lsl: 1.2, usl: 1.45, unit: 'Ω' })).toBe('1.2 … 1.45\u202fΩ');
  });
  it('when only one limit exists, then it shows that limit alone', () => {
    expect(formatLimits({ lsl: 100, usl: null, unit: 'MΩ' })).toBe('≥ 100\u202fMΩ');
    expect(formatLimits({ lsl: null, usl: 5, unit: 'mA' })).toBe('≤ 5\u202fmA');
  });
  it('when the unit is the dimensionless 1, then no unit is shown', () => {
    expect(displayUnit('1')).toBeUndefined();
    expect(formatLimits({ lsl: 1.2, usl: null, unit: '1' })).toBe('≥ 1.2');
  });
});

describe('barScale', () => {
  it('when two-sided, then LSL sits at 20 %, USL at 80 % and the value between', () => {
    expect(barScale({ value: 1.5, lsl: 1, usl: 2 })).toEqual({ lslAt: 20, uslAt: 80, valueAt: 50 });
  });
  it('when the value is far outside, then it is pinned to the end of the bar', () => {
    expect(barScale({ value: 10, lsl: 1, usl: 2 })?.valueAt).toBe(100);
  });
  it('when only a USL exists, then the limit sits mid-bar and a passing value left of it', () => {
    const scale = barScale({ value: 0.1, lsl: null, usl: 0.5 });
    expect(scale?.uslAt).toBe(50);
    expect(scale?.lslAt).toBeUndefined();
    expect(scale?.valueAt).toBeLessThan(50);
  });
  it('when there is no limit, then there is no bar', () => {
    expect(barScale({ value: 3, lsl: null, usl: null })).toBeUndefined();
  });
});

describe('isHighVoltageResult', () => {
  it('when the step is hipot or insulation, then the caution applies', () => {
    expect(isHighVoltageResult({ characteristic: 'hipot_leakage', name: 'Hipot leakage current', testStep: 'hipot' })).toBe(true);
    expect(isHighVoltageResult({ characteristic: 'ir_40c', name: 'Insulation resistance', testStep: 'insulation' })).toBe(true);
    expect(isHighVoltageResult({ characteristic: 'ke', name: 'Back-EMF constant', testStep: 'back-emf' })).toBe(false);
  });
});
