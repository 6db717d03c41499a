import { requirePositive } from './validate.js';

/*
 * Back-EMF constant to torque constant for a sinusoidal PMSM. With E_ph = Ke_LL/√3 per phase and
 * power balance T·ω = 3·E_ph·I, Kt = 3·Ke_ph = √3·Ke_LL [N·m/A_rms] when Ke is in V_LL,rms·s/rad
 * (standard PMSM relations; equivalently the dq-model torque T = 1.5·p·λ·i_q).
 */

/** Mechanical speed of 1000 rpm in rad/s: 1000·2π/60. */
const RAD_PER_S_AT_1000_RPM = (1000 * 2 * Math.PI) / 60;

type KeInput = number | { keVPerKrpm: number };

function keFrom(input: KeInput): number {
  const keVPerKrpm = typeof input === 'number' ? input : input?.keVPerKrpm;
  return requirePositive('keVPerKrpm', keVPerKrpm);
}

/**
 * Ke in SI units, V_LL,rms·s/rad, from the test-stand figure in V_LL,rms per 1000 rpm:
 * Ke_SI = Ke / (1000·2π/60) (standard PMSM relations). 50 V/krpm → 0.47746 V·s/rad.
 * Accepts the number itself or `{ keVPerKrpm }`.
 */
export function keVoltSecondPerRad(input: KeInput): number {
  return keFrom(input) / RAD_PER_S_AT_1000_RPM;
}

/**
 * Torque constant Kt [N·m/A_rms] = √3·Ke [V_LL,rms·s/rad] for a sinusoidal back-EMF
 * (standard PMSM relations). 50 V/krpm → 0.82699 N·m/A_rms. Accepts the number or `{ keVPerKrpm }`.
 */
export function torqueConstantNmPerA(input: KeInput): number {
  return Math.sqrt(3) * keVoltSecondPerRad(input);
}

/** The Ke → Kt conversion under its short name; identical to {@link torqueConstantNmPerA}. */
export const keToKt = torqueConstantNmPerA;
