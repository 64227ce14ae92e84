/**
 * Exact null distribution of the Mann–Whitney statistic U for samples of sizes m and n without
 * ties: every one of the C(m+n, m) orderings is equally likely, and the number of them with U = u
 * satisfies f(m, n, u) = f(m−1, n, u−n) + f(m, n−1, u) (H. B. Mann & D. R. Whitney, Ann. Math.
 * Statist. 18 (1947) 50–60, from memory; recurrence as in numerics-references §8.1).
 */

/** Largest m and n for which the exact distribution is used by default. */
export const EXACT_MANN_WHITNEY_MAX = 50;

/**
 * P(U = u), u = 0..m·n, for U = #{(i, j): x_i > y_j} with continuous x of size m, y of size n.
 * Method: the recurrence above in probabilities,
 * p(i, j, u) = i/(i+j)·p(i−1, j, u−j) + j/(i+j)·p(i, j−1, u), which never forms the huge counts.
 * Columns j = 0..n are swept keeping p(i, j−1, ·) for all i. Cost O(m²n²/4) flops, memory O(m²n).
 * Throws RangeError unless m and n are non-negative integers.
 */
export function mannWhitneyProbabilities(m: number, n: number): Float64Array {
  if (!Number.isInteger(m) || m < 0)
    throw new RangeError(`m must be a non-negative integer, got ${m}`);
  if (!Number.isInteger(n) || n < 0)
    throw new RangeError(`n must be a non-negative integer, got ${n}`);
  // prev[i] holds p(i, j−1, ·) of length i·(j−1) + 1; with j = 0 every distribution is U ≡ 0.
  let prev: Float64Array[] = Array.from({ length: m + 1 }, () => Float64Array.of(1));
  for (let j = 1; j <= n; j++) {
    const next: Float64Array[] = [Float64Array.of(1)];
    for (let i = 1; i <= m; i++) {
      const p = new Float64Array(i * j + 1);
      const fromX = next[i - 1]!; // p(i−1, j, ·): the largest value is an x, exceeding all j y's
      const fromY = prev[i]!; // p(i, j−1, ·): the largest value is a y, adding nothing to U
      const wx = i / (i + j);
      const wy = j / (i + j);
      for (let u = 0; u < fromX.length; u++) p[u + j]! += wx * fromX[u]!;
      for (let u = 0; u < fromY.length; u++) p[u]! += wy * fromY[u]!;
      next.push(p);
    }
    prev = next;
  }
  return prev[m]!;
}

/** P(U ≤ u) from the probabilities above (0 for u < 0, 1 for u ≥ m·n). */
export function lowerTailFromProbabilities(probabilities: Float64Array, u: number): number {
  let s = 0;
  const top = Math.min(Math.floor(u), probabilities.length - 1);
  for (let k = 0; k <= top; k++) s += probabilities[k]!;
  return Math.min(1, s);
}
