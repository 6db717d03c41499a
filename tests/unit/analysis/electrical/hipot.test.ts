import { describe, expect, it } from 'vitest';
import {
  hipotDcEquivalentV,
  hipotRepeatTestVoltage,
  hipotTestVoltage,
} from '../../../../server/analysis/electrical/index.js';

describe('hipotTestVoltage', () => {
  it('when a 400 V 15 kW motor is tested, then the voltage is 1000 + 2·400 = 1800 V AC for 60 s', () => {
    // IEC 60034-1 Table 16 item 2: 1000 V + 2·U_N, minimum 1500 V, 1 min
    const test = hipotTestVoltage({ ratedVoltageV: 400, ratedPowerKw: 15 });
    expect(test.acVrms).toBe(1800);
    expect(test.durationS).toBe(60);
    expect(test.source).toMatch(/IEC 60034-1 Table 16/);
  });

  it('when a 230 V motor is tested, then the 1500 V minimum applies instead of 1460 V', () => {
    // IEC 60034-1 Table 16 item 2: 1000 + 2·230 = 1460 V is raised to the 1500 V minimum
    expect(hipotTestVoltage({ ratedVoltageV: 230, ratedPowerKw: 2.2 }).acVrms).toBe(1500);
  });

  it('when a 48 V 0.5 kW motor is tested, then the small-machine row gives 500 + 2·48 = 596 V', () => {
    // IEC 60034-1 Table 16 item 1: output < 1 kW and voltage < 100 V → 500 V + 2·U_N
    expect(hipotTestVoltage({ ratedVoltageV: 48, ratedPowerKw: 0.5 }).acVrms).toBe(596);
  });

  it('when a 48 V motor is rated 1 kW or more, then item 2 and its 1500 V minimum apply', () => {
    // IEC 60034-1 Table 16: item 1 needs both output < 1 kW and voltage < 100 V
    expect(hipotTestVoltage({ ratedVoltageV: 48, ratedPowerKw: 1 }).acVrms).toBe(1500);
  });

  it('when the production test is read, then it is 120 % for 1 s, labelled as recalled', () => {
    // IEC 60034-1 §9.2 shortened routine test, from memory: 1.2 × 1800 V = 2160 V for 1 s
    const { production } = hipotTestVoltage({ ratedVoltageV: 400, ratedPowerKw: 15 });
    expect(production.acVrms).toBeCloseTo(2160, 9);
    expect(production.durationS).toBe(1);
    expect(production.source).toBe('IEC 60034-1 §9.2 shortened routine test, from memory');
  });

  it('when the machine is 10 000 kW or more, then it throws saying those rows are out of scope', () => {
    expect(() => hipotTestVoltage({ ratedVoltageV: 11000, ratedPowerKw: 10000 })).toThrow(/ratedPowerKw.*out of scope/);
  });

  it('when an argument is not a positive finite number, then it throws naming it', () => {
    expect(() => hipotTestVoltage({ ratedVoltageV: -400, ratedPowerKw: 15 })).toThrow(/ratedVoltageV/);
    expect(() => hipotTestVoltage({ ratedVoltageV: 400, ratedPowerKw: Number.NaN })).toThrow(/ratedPowerKw.*finite/);
  });
});

describe('hipot derived voltages', () => {
  it('when a winding is tested again, then 80 % of 1800 V = 1440 V', () => {
    // common practice: repeated withstand tests at 80 % of the original voltage
    expect(hipotRepeatTestVoltage(1800)).toBeCloseTo(1440, 9);
  });

  it('when a DC hipot replaces 1800 V AC, then it is 1.7 × 1800 = 3060 V', () => {
    // common practice: DC ≈ 1.7 × AC RMS
    expect(hipotDcEquivalentV(1800)).toBeCloseTo(3060, 9);
  });

  it('when the AC voltage is not positive, then it throws naming acVrms', () => {
    expect(() => hipotRepeatTestVoltage(0)).toThrow(/acVrms/);
    expect(() => hipotDcEquivalentV(Number.POSITIVE_INFINITY)).toThrow(/acVrms/);
  });
});
