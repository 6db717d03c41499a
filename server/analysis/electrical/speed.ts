import { requireFinite, requireNonNegative, requirePositive, requirePositiveInteger } from './validate.js';

/**
 * Synchronous speed nₛ = 120·f/P [rpm] for P poles on supply frequency f (common practice;
 * e.g. NEMA MG 1 and any machines handbook). A 4-pole machine turns 1500 rpm on 50 Hz.
 */
export function synchronousSpeedRpm(input: { frequencyHz: number; poles: number }): number {
  const frequencyHz = requirePositive('frequencyHz', input.frequencyHz);
  const poles = requirePositiveInteger('poles', input.poles);
  if (poles % 2 !== 0) throw new Error(`poles must be even (poles come in north–south pairs), got ${poles}`);
  return (120 * frequencyHz) / poles;
}

/**
 * Slip s = 100·(nₛ − n)/nₛ [%] of an induction motor (common practice). Negative slip means the
 * rotor runs above synchronous speed (generating), which a test record may legitimately show.
 */
export function slipPercent(input: { synchronousSpeedRpm: number; speedRpm: number }): number {
  const synchronousRpm = requirePositive('synchronousSpeedRpm', input.synchronousSpeedRpm);
  const speedRpm = requireFinite('speedRpm', input.speedRpm);
  return (100 * (synchronousRpm - speedRpm)) / synchronousRpm;
}

/**
 * Electrical frequency f = p·n/60 [Hz] for p pole pairs at n rpm (common practice). On a back-EMF
 * spin this checks the pole count: a 4-pole-pair rotor at 1500 rpm generates 100 Hz.
 */
export function electricalFrequencyHz(input: { speedRpm: number; polePairs: number }): number {
  const speedRpm = requireNonNegative('speedRpm', input.speedRpm);
  const polePairs = requirePositiveInteger('polePairs', input.polePairs);
  return (polePairs * speedRpm) / 60;
}
