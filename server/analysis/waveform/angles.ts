/**
 * Angle wrapping in degrees. Kept apart because sign and range conventions decide what an
 * offset or a phase spacing means, and every caller must use the same ones.
 */

/** Wraps an angle to (−180°, 180°], the range of a signed angle difference (common practice). */
export function wrapDegrees180(angleDeg: number): number {
  requireFiniteAngle(angleDeg);
  const wrapped = angleDeg - 360 * Math.ceil((angleDeg - 180) / 360);
  // Rounding can land exactly on the excluded end of the range.
  return wrapped <= -180 ? wrapped + 360 : wrapped;
}

/** Wraps an angle to [0°, 360°), the range of a lag measured in one direction (common practice). */
export function wrapDegrees360(angleDeg: number): number {
  requireFiniteAngle(angleDeg);
  const wrapped = angleDeg - 360 * Math.floor(angleDeg / 360);
  return wrapped >= 360 ? wrapped - 360 : wrapped;
}

/** Degrees in one radian. */
export const DEG_PER_RAD = 180 / Math.PI;

function requireFiniteAngle(angleDeg: number): void {
  if (typeof angleDeg !== 'number' || !Number.isFinite(angleDeg)) {
    throw new Error(`angleDeg must be a finite number of degrees, got ${String(angleDeg)}`);
  }
}
