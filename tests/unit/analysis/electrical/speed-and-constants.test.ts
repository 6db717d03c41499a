import { describe, expect, it } from 'vitest';
import {
  electricalFrequencyHz,
  isolationResistanceMinimumOhm,
  keToKt,
  keVoltSecondPerRad,
  slipPercent,
  synchronousSpeedRpm,
  torqueConstantNmPerA,
} from '../../../../server/analysis/electrical/index.js';

describe('synchronousSpeedRpm, slipPercent, electricalFrequencyHz', () => {
  it('when a 4-pole machine runs on 50 Hz or 60 Hz, then nₛ is 1500 or 1800 rpm', () => {
    // nₛ = 120·f/P (common practice; NEMA MG 1 synchronous-speed tables)
    expect(synchronousSpeedRpm({ frequencyHz: 50, poles: 4 })).toBe(1500);
    expect(synchronousSpeedRpm({ frequencyHz: 60, poles: 4 })).toBe(1800);
    expect(synchronousSpeedRpm({ frequencyHz: 60, poles: 6 })).toBe(1200);
  });

  it('when poles is odd, zero, fractional or not finite, then it throws naming poles', () => {
    expect(() => synchronousSpeedRpm({ frequencyHz: 50, poles: 3 })).toThrow(/poles.*even/);
    expect(() => synchronousSpeedRpm({ frequencyHz: 50, poles: 0 })).toThrow(/poles/);
    expect(() => synchronousSpeedRpm({ frequencyHz: 50, poles: 4.5 })).toThrow(/poles.*whole/);
    expect(() => synchronousSpeedRpm({ frequencyHz: Number.NaN, poles: 4 })).toThrow(/frequencyHz/);
  });

  it('when a 4-pole 60 Hz motor runs at its 1750 rpm nameplate speed, then slip is 2.78 %', () => {
    // s = (nₛ − n)/nₛ = 50/1800 (common practice; typical NEMA design B nameplate)
    expect(slipPercent({ synchronousSpeedRpm: 1800, speedRpm: 1750 })).toBeCloseTo(2.7778, 4);
  });

  it('when the rotor runs above synchronous speed, then slip is negative', () => {
    // common practice: negative slip = generating
    expect(slipPercent({ synchronousSpeedRpm: 1500, speedRpm: 1530 })).toBeCloseTo(-2, 12);
  });

  it('when the synchronous speed is not positive, then it throws naming it', () => {
    expect(() => slipPercent({ synchronousSpeedRpm: 0, speedRpm: 10 })).toThrow(/synchronousSpeedRpm/);
  });

  it('when a 4-pole-pair rotor spins at 1500 rpm, then the back-EMF is at 100 Hz', () => {
    // f = p·n/60 (common practice)
    expect(electricalFrequencyHz({ speedRpm: 1500, polePairs: 4 })).toBe(100);
  });

  it('when polePairs is not a positive whole number or speed is negative, then it throws naming it', () => {
    expect(() => electricalFrequencyHz({ speedRpm: 1500, polePairs: 0 })).toThrow(/polePairs/);
    expect(() => electricalFrequencyHz({ speedRpm: 1500, polePairs: 2.5 })).toThrow(/polePairs.*whole/);
    expect(() => electricalFrequencyHz({ speedRpm: -1, polePairs: 4 })).toThrow(/speedRpm.*negative/);
  });
});

describe('isolationResistanceMinimumOhm', () => {
  it('when a 400 V DC bus is checked, then the minimum is 100 Ω/V × 400 V = 40 kΩ', () => {
    // UNECE R100 / ISO 6469-3: 100 Ω/V on DC buses
    expect(isolationResistanceMinimumOhm({ workingVoltageV: 400, bus: 'dc' })).toBe(40_000);
  });

  it('when a 400 V AC bus is checked, then the minimum is 500 Ω/V × 400 V = 200 kΩ', () => {
    // UNECE R100 / ISO 6469-3: 500 Ω/V on AC buses
    expect(isolationResistanceMinimumOhm({ workingVoltageV: 400, bus: 'ac' })).toBe(200_000);
  });

  it('when the voltage is not positive or the bus kind is unknown, then it throws naming the argument', () => {
    expect(() => isolationResistanceMinimumOhm({ workingVoltageV: 0, bus: 'dc' })).toThrow(/workingVoltageV/);
    expect(() => isolationResistanceMinimumOhm({ workingVoltageV: 400, bus: 'hv' as 'dc' })).toThrow(/bus/);
  });
});

describe('Ke to Kt', () => {
  it('when Ke is 50 V/krpm, then Ke = 0.47746 V·s/rad and Kt = 0.82699 N·m/A_rms', () => {
    // standard PMSM relations: ω at 1000 rpm = 104.72 rad/s; Kt = √3·Ke_LL
    expect(keVoltSecondPerRad(50)).toBeCloseTo(0.47746, 5);
    expect(torqueConstantNmPerA(50)).toBeCloseTo(0.82699, 5);
    expect(torqueConstantNmPerA({ keVPerKrpm: 50 })).toBeCloseTo(0.82699, 5);
    expect(keToKt(50)).toBeCloseTo(0.82699, 5);
  });

  it('when Kt is checked by power balance, then T·ω equals three-phase power √3·V_LL·I at unity power factor', () => {
    // three-phase power P = √3·V_LL·I (common practice): 50 V_LL at 1000 rpm, 10 A in phase with EMF
    const currentA = 10;
    const omegaRadPerS = (1000 * 2 * Math.PI) / 60;
    const torqueNm = torqueConstantNmPerA(50) * currentA;
    expect(torqueNm * omegaRadPerS).toBeCloseTo(Math.sqrt(3) * 50 * currentA, 9);
  });

  it('when Ke is not positive, then it throws naming keVPerKrpm', () => {
    expect(() => keVoltSecondPerRad(-5)).toThrow(/keVPerKrpm/);
    expect(() => torqueConstantNmPerA({ keVPerKrpm: Number.NaN })).toThrow(/keVPerKrpm.*finite/);
  });
});
