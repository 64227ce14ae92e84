import { quantileSorted, sortedCopy } from '@sandbox/stats/quantiles.ts';

/**
 * The distribution summary reported for one kernel's times at one size: minimum, quartiles and
 * median (Hyndman & Fan type 7), as numerics-references §8.4 recommends over mean ± sd for
 * positive, heavy-tailed timing noise (Chen & Revels, arXiv:1608.04295, 2016).
 */
export interface TimeSummary {
  minMs: number;
  q1Ms: number;
  medianMs: number;
  q3Ms: number;
}

/** Summary of a non-empty list of times in ms. Cost: one sort. Throws RangeError when empty. */
export function summariseTimes(ms: readonly number[]): TimeSummary {
  if (ms.length === 0) throw new RangeError('ms must not be empty');
  const sorted = sortedCopy(ms);
  return {
    minMs: sorted[0]!,
    q1Ms: quantileSorted(sorted, 0.25),
    medianMs: quantileSorted(sorted, 0.5),
    q3Ms: quantileSorted(sorted, 0.75),
  };
}
