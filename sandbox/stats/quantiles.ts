/**
 * Sample quantiles by Hyndman & Fan's definition 7 (R's and NumPy's default): for sorted
 * x_(1) ≤ … ≤ x_(n) and 0 ≤ p ≤ 1, h = (n − 1)·p and Q(p) = x_(⌊h⌋+1) + (h − ⌊h⌋)·(x_(⌊h⌋+2) − x_(⌊h⌋+1))
 * (R. J. Hyndman & Y. Fan, "Sample quantiles in statistical packages", Amer. Statist. 50 (1996)
 * 361–365, from memory). With p = ½ this is the ordinary median.
 */

/** A sorted copy of `values` (ascending); the input is not touched. */
export function sortedCopy(values: ArrayLike<number>): Float64Array {
  return Float64Array.from(values).sort();
}

/**
 * Q(p) of an already ascending-sorted sample, Hyndman & Fan type 7 (see the module comment).
 * Cost O(1). Throws RangeError when the sample is empty or p is outside [0, 1].
 */
export function quantileSorted(sorted: ArrayLike<number>, p: number): number {
  const n = sorted.length;
  if (n === 0) throw new RangeError('sorted must not be empty');
  if (!(p >= 0 && p <= 1)) throw new RangeError(`p must lie in [0, 1], got ${p}`);
  const h = (n - 1) * p;
  const lo = Math.floor(h);
  const below = sorted[lo]!;
  if (lo + 1 >= n) return below;
  return below + (h - lo) * (sorted[lo + 1]! - below);
}

/** Q(p) of an unsorted sample (type 7). Cost: one sort. */
export function quantile(values: ArrayLike<number>, p: number): number {
  return quantileSorted(sortedCopy(values), p);
}

/** The median (type 7 at p = ½: the middle value, or the mean of the two middle values). */
export function median(values: ArrayLike<number>): number {
  return quantile(values, 0.5);
}

/** Lower quartile, median and upper quartile (type 7 at p = ¼, ½, ¾), sorting once. */
export function quartiles(values: ArrayLike<number>): { q1: number; median: number; q3: number } {
  const sorted = sortedCopy(values);
  return {
    q1: quantileSorted(sorted, 0.25),
    median: quantileSorted(sorted, 0.5),
    q3: quantileSorted(sorted, 0.75),
  };
}
