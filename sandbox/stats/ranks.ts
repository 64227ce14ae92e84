/**
 * Average ranks ("mid-ranks") of a sample, with the sizes of its groups of tied values: the
 * common ingredient of the Wilcoxon signed-rank and Mann–Whitney statistics (Hollander, Wolfe &
 * Chicken, Nonparametric Statistical Methods, 3rd ed., 2014, §3.1 and §4.1, from memory).
 */

/** Ranks 1..n, tied values sharing the average of the ranks they occupy; tieSizes lists t_g ≥ 2. */
export interface AverageRanks {
  ranks: Float64Array;
  tieSizes: number[];
}

/**
 * Average ranks of `values` (ascending: the smallest value gets rank 1). Equal values (===) form a
 * tie group of size t and all get the mean of their t consecutive ranks.
 * Cost: one sort, O(n log n). Throws TypeError when a value is NaN (NaN has no rank).
 */
export function averageRanks(values: ArrayLike<number>): AverageRanks {
  const n = values.length;
  for (let i = 0; i < n; i++) {
    if (Number.isNaN(values[i]!)) throw new TypeError(`values[${i}] is NaN; NaN has no rank`);
  }
  const order = Array.from({ length: n }, (_, i) => i).sort((a, b) => values[a]! - values[b]!);
  const ranks = new Float64Array(n);
  const tieSizes: number[] = [];
  let start = 0;
  while (start < n) {
    let end = start + 1;
    while (end < n && values[order[end]!]! === values[order[start]!]!) end++;
    // Positions start..end−1 (0-based) hold ranks start+1..end; their mean is (start + 1 + end)/2.
    const rank = (start + 1 + end) / 2;
    for (let k = start; k < end; k++) ranks[order[k]!] = rank;
    if (end - start > 1) tieSizes.push(end - start);
    start = end;
  }
  return { ranks, tieSizes };
}

/** Σ_g (t_g³ − t_g) over tie groups, the quantity every tie correction of a rank variance uses. */
export function tieCubeSum(tieSizes: readonly number[]): number {
  let s = 0;
  for (const t of tieSizes) s += t * t * t - t;
  return s;
}
