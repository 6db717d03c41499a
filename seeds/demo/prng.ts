/**
 * A small seeded pseudo-random generator (mulberry32) with the draws the demo plant needs, so
 * the same seed builds the same plant every time. Not for anything security-related.
 */
export type Prng = {
  /** Uniform in [0, 1). */
  next(): number;
  uniform(min: number, max: number): number;
  /** Normal with the given mean and standard deviation (Box–Muller). */
  normal(mean: number, sd: number): number;
  /** Log-normal whose median is `median` and whose log has standard deviation `sdLog`. */
  logNormal(median: number, sdLog: number): number;
  chance(probability: number): boolean;
  int(minInclusive: number, maxInclusive: number): number;
  pick<T>(items: readonly T[]): T;
  /** A version-4-shaped UUID from the generator's own stream. */
  uuid(): string;
};

export function createPrng(seed: number): Prng {
  let state = seed >>> 0;
  const next = (): number => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  const normal = (mean: number, sd: number): number => {
    const u = 1 - next(); // (0, 1], so the logarithm is finite
    const v = next();
    return mean + sd * Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v);
  };
  const int = (minInclusive: number, maxInclusive: number): number =>
    minInclusive + Math.floor(next() * (maxInclusive - minInclusive + 1));
  const hex = (digits: number): string =>
    Array.from({ length: digits }, () => int(0, 15).toString(16)).join('');
  return {
    next,
    uniform: (min, max) => min + (max - min) * next(),
    normal,
    logNormal: (median, sdLog) => median * Math.exp(normal(0, sdLog)),
    chance: (probability) => next() < probability,
    int,
    pick: (items) => items[int(0, items.length - 1)],
    uuid: () => `${hex(8)}-${hex(4)}-4${hex(3)}-${'89ab'[int(0, 3)]}${hex(3)}-${hex(12)}`,
  };
}

/** An independent stream for one part of the plan, so adding draws in one part leaves the others alone. */
export function forkPrng(seed: number, label: string): Prng {
  let hash = seed >>> 0;
  for (const char of label) hash = Math.imul(hash ^ char.charCodeAt(0), 0x01000193) >>> 0;
  return createPrng(hash);
}
