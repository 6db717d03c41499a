/**
 * Process-level yield metrics from the six-sigma literature (common practice; e.g. Minitab's help
 * on rolled throughput yield).
 */

function requireUnitInterval(name: string, value: number): number {
  if (!Number.isFinite(value) || value < 0 || value > 1) {
    throw new Error(`${name} must be a fraction from 0 to 1, got ${String(value)}`);
  }
  return value;
}

function requireWholeNumber(name: string, value: number, minimum: number): number {
  if (!Number.isInteger(value) || value < minimum) {
    throw new Error(`${name} must be a whole number of at least ${minimum}, got ${String(value)}`);
  }
  return value;
}

/**
 * Rolled throughput yield RTY = Π FPYᵢ over the stations in sequence: the probability that a unit
 * passes every station first time (common practice; Minitab's label example
 * 0.95 × 0.84 × 0.88 = 0.70). Unlike final yield, rework hidden between stations lowers it.
 */
export function rolledThroughputYield(stationYields: number[]): number {
  if (!Array.isArray(stationYields) || stationYields.length === 0) {
    throw new Error('stationYields must hold at least one station yield');
  }
  return stationYields.reduce(
    (product, stationYield, i) => product * requireUnitInterval(`stationYields[${i}]`, stationYield),
    1,
  );
}

/**
 * Defects per million opportunities DPMO = 10⁶·defects / (units × opportunities per unit)
 * (common practice in the six-sigma literature). An opportunity can
 * hold at most one defect, so defects may not exceed units × opportunities.
 */
export function dpmo(input: { defects: number; units: number; opportunitiesPerUnit: number }): number {
  const defects = requireWholeNumber('defects', input.defects, 0);
  const units = requireWholeNumber('units', input.units, 1);
  const opportunitiesPerUnit = requireWholeNumber('opportunitiesPerUnit', input.opportunitiesPerUnit, 1);
  const opportunities = units * opportunitiesPerUnit;
  if (defects > opportunities) {
    throw new Error(`defects must not exceed units × opportunitiesPerUnit (${opportunities}), got ${defects}`);
  }
  return (1_000_000 * defects) / opportunities;
}
