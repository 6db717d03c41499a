import type { Prng } from '../prng.js';
import type { FaultKind } from '../faults.js';

/** How a lot differs from the long-run process (material lots: magnets, copper, resolver batch). */
export type LotProcess = { keShiftPct: number; resistanceShiftPct: number; resolverShiftDeg: number };

export type MotorContext = {
  prng: Prng;
  lot: LotProcess;
  /** Extra Ke drift of this motor in percent (the drifting lot's story); 0 elsewhere. */
  keDriftPct: number;
};

/** One motor's true properties; each call measures it once more, with the faults it has then. */
export type MotorModel = { measure(faults: ReadonlySet<FaultKind>): Record<string, number> };

export function drawLotProcess(prng: Prng): LotProcess {
  return { keShiftPct: prng.normal(0, 0.15), resistanceShiftPct: prng.normal(0, 0.5), resolverShiftDeg: prng.normal(0, 0.4) };
}

export const round = (value: number, decimals: number): number => Number(value.toFixed(decimals));

/** Phase resistances with a common motor value and a small phase-to-phase spread. */
export function phaseResistances(prng: Prng, base: number, phaseSpread: number): [number, number, number] {
  return [0, 1, 2].map(() => base * (1 + prng.normal(0, phaseSpread))) as [number, number, number];
}

/** A positive quantity with a floor (leakage currents, vibration): normal, clipped at `floor`. */
export const atLeast = (floor: number, value: number): number => Math.max(floor, value);
