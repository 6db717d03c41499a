/**
 * Judging one measured value against its specification limits. Convention (common practice):
 * limits are inclusive, so a value exactly on a limit conforms. A null limit means no limit on that side. A value that is not a finite number is a
 * failed measurement and never passes.
 */

export interface SpecLimits {
  lsl: number | null;
  usl: number | null;
}

function requireLimits(limits: SpecLimits): SpecLimits {
  if (limits === null || typeof limits !== 'object') {
    throw new Error('limits must be an object with lsl and usl (null for no limit)');
  }
  for (const side of ['lsl', 'usl'] as const) {
    const limit = limits[side];
    if (limit !== null && !Number.isFinite(limit)) {
      throw new Error(`limits.${side} must be a finite number or null, got ${String(limit)}`);
    }
  }
  if (limits.lsl !== null && limits.usl !== null && limits.lsl > limits.usl) {
    throw new Error(`limits.lsl (${limits.lsl}) must not be above limits.usl (${limits.usl})`);
  }
  return limits;
}

/**
 * Pass when LSL ≤ value ≤ USL (limits inclusive, common practice); one-sided limits allowed,
 * no limits at all → pass; a non-finite value (NaN, ±Infinity) → fail.
 */
export function judge(value: number, limits: SpecLimits): 'pass' | 'fail' {
  const { lsl, usl } = requireLimits(limits);
  if (!Number.isFinite(value)) return 'fail';
  if (lsl !== null && value < lsl) return 'fail';
  if (usl !== null && value > usl) return 'fail';
  return 'pass';
}

/**
 * Where a value sits between LSL (0) and USL (1), for the limit bar on screen. Clamped to 0…1 so an out-of-limit value pins to its end; the verdict, not
 * the bar, says pass or fail. Null when a side is open, the limits coincide or the value is not finite.
 */
export function positionInLimits(value: number, limits: SpecLimits): number | null {
  const { lsl, usl } = requireLimits(limits);
  if (lsl === null || usl === null || lsl === usl || !Number.isFinite(value)) return null;
  return Math.min(1, Math.max(0, (value - lsl) / (usl - lsl)));
}
