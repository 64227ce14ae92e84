/**
 * Exact null distribution of the Wilcoxon signed-rank statistic: under H₀ (differences symmetric
 * about 0) each of the n ranked differences is positive with probability ½ independently, so
 * T⁺ = Σ (scores of the positive ones) has P(T⁺ = t) = c(t)/2ⁿ, c(t) the number of subsets of the
 * scores summing to t (Wilcoxon 1945; Hollander, Wolfe & Chicken, 3rd ed., 2014, §3.1, from memory).
 * The scores are integers: the ranks 1..n, or doubled mid-ranks when there are ties, which gives
 * the exact conditional (permutation) distribution given the ties (Lehmann, Nonparametrics, 1975,
 * ch. 3, from memory).
 */

/** Largest n for which the subset counts (at most 2ⁿ) are exact integers in binary64. */
export const EXACT_SIGNED_RANK_MAX_N = 50;

/**
 * Subset-sum counts c(t), t = 0..Σ scores, of the given non-negative integer scores.
 * Method: dynamic programming over the scores, c_k(t) = c_{k−1}(t) + c_{k−1}(t − s_k).
 * Cost O(n·Σ scores). Throws RangeError when a score is not a non-negative integer or there are
 * more than EXACT_SIGNED_RANK_MAX_N scores.
 */
export function signedRankCounts(scores: ArrayLike<number>): Float64Array {
  const n = scores.length;
  if (n > EXACT_SIGNED_RANK_MAX_N) {
    throw new RangeError(`scores: at most ${EXACT_SIGNED_RANK_MAX_N} entries, got ${n}`);
  }
  let total = 0;
  for (let k = 0; k < n; k++) {
    const s = scores[k]!;
    if (!Number.isInteger(s) || s < 0) {
      throw new RangeError(`scores[${k}] must be a non-negative integer, got ${s}`);
    }
    total += s;
  }
  const counts = new Float64Array(total + 1);
  counts[0] = 1;
  let reach = 0;
  for (let k = 0; k < n; k++) {
    const s = scores[k]!;
    reach += s;
    // Descending t so that each score is used at most once (the 0/1 knapsack order); a zero
    // score doubles every count in place, as it should.
    for (let t = reach; t >= s; t--) counts[t]! += counts[t - s]!;
  }
  return counts;
}

/** Counts for the untied case, scores 1..n: c(t) for t = 0..n(n+1)/2. */
export function signedRankCountsUntied(n: number): Float64Array {
  if (!Number.isInteger(n) || n < 0)
    throw new RangeError(`n must be a non-negative integer, got ${n}`);
  return signedRankCounts(Array.from({ length: n }, (_, i) => i + 1));
}

/** P(T⁺ ≤ t) from counts over 2ⁿ outcomes; t below 0 gives 0. */
export function lowerTailFromCounts(counts: Float64Array, n: number, t: number): number {
  let s = 0;
  const top = Math.min(Math.floor(t), counts.length - 1);
  for (let k = 0; k <= top; k++) s += counts[k]!;
  return s / 2 ** n;
}
