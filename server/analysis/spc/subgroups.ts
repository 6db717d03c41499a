import { mean } from './descriptive.js';
import { requireFiniteArray } from './validate.js';

/** What the X̄-R and X̄-S charts share: checked subgroups, their sizes and the grand mean. */
export interface SubgroupSummary {
  sizes: number[];
  means: number[];
  /** x̿ weighted by subgroup size, so each measurement counts once (Montgomery, ISQC §6.3.2) */
  grandMean: number;
  equalSizes: boolean;
  /**
   * The size the summary-level limits are drawn for: the common size, or with unequal sizes the
   * rounded average size, the approximation Montgomery (ISQC §7.2.2, section from memory) uses
   * for charts with variable sample size. Per-subgroup limits are exact.
   */
  representativeSize: number;
}

/** Checks subgroup sizes (minSize…maxSize, all values finite) and summarises them. */
export function summarizeSubgroups(
  subgroups: readonly (readonly number[])[],
  minSize: number,
  maxSize: number,
): SubgroupSummary {
  if (!Array.isArray(subgroups) || subgroups.length === 0) {
    throw new Error('subgroups must be a non-empty array of number arrays');
  }
  const sizes: number[] = [];
  const means: number[] = [];
  let total = 0;
  let count = 0;
  subgroups.forEach((subgroup, i) => {
    requireFiniteArray(`subgroups[${i}]`, subgroup, minSize);
    if (subgroup.length > maxSize) {
      throw new Error(`subgroups[${i}] must hold at most ${maxSize} values, got ${subgroup.length}`);
    }
    sizes.push(subgroup.length);
    means.push(mean(subgroup));
    for (const v of subgroup) total += v;
    count += subgroup.length;
  });
  const equalSizes = sizes.every((n) => n === sizes[0]);
  return {
    sizes,
    means,
    grandMean: total / count,
    equalSizes,
    representativeSize: equalSizes ? sizes[0] : Math.round(count / sizes.length),
  };
}
