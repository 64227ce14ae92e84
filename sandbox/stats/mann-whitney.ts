import {
  EXACT_MANN_WHITNEY_MAX,
  lowerTailFromProbabilities,
  mannWhitneyProbabilities,
} from '@sandbox/stats/mann-whitney-distribution.ts';
import { normalUpperTail } from '@sandbox/stats/normal.ts';
import { averageRanks, tieCubeSum } from '@sandbox/stats/ranks.ts';

/**
 * The Mann–Whitney (Wilcoxon rank-sum) test of H₀ "x and y come from one distribution",
 * two-sided (Mann & Whitney 1947; Wilcoxon 1945; Hollander, Wolfe & Chicken, 3rd ed., 2014, ch. 4,
 * from memory; formulas as restated in numerics-references §8.1).
 */

export interface MannWhitneyOptions {
  /** 'auto' (default): exact when there are no ties and m, n ≤ EXACT_MANN_WHITNEY_MAX. */
  method?: 'auto' | 'exact' | 'normal';
  /** Continuity correction ½ in the normal approximation (default true). */
  continuity?: boolean;
}

export interface MannWhitneyTest {
  /** U_x = #{(i, j): x_i > y_j} + ½·#{x_i = y_j}; U_y = m·n − U_x. */
  u: number;
  /** Var U under H₀ with the tie correction. */
  variance: number;
  method: 'exact' | 'normal';
  /** Standardised statistic (normal method), signed like U − mn/2. */
  z: number | null;
  pValue: number;
}

/**
 * Two-sided Mann–Whitney test of samples x (size m) and y (size n), both non-empty.
 * U_x = R_x − m(m+1)/2 with R_x the sum of x's mid-ranks in the pooled sample. Under H₀,
 * E U = mn/2 and Var U = (mn/12)·[(N+1) − Σ_g(t_g³ − t_g)/(N(N−1))], N = m + n (tie correction).
 * Exact: p = min(1, 2·min(P(U ≤ u), P(U ≥ u))) from the exact distribution (no ties). Normal:
 * z = (|U − mn/2| − ½)/√Var, p = 2(1 − Φ(|z|)). Cost O((m+n) log(m+n)); exact O(m²n²).
 * Throws RangeError when a sample is empty or holds a non-finite value.
 */
export function mannWhitneyU(
  x: ArrayLike<number>,
  y: ArrayLike<number>,
  options: MannWhitneyOptions = {},
): MannWhitneyTest {
  const m = x.length;
  const n = y.length;
  if (m === 0) throw new RangeError('x must not be empty');
  if (n === 0) throw new RangeError('y must not be empty');
  const pooled = [...Array.from(x), ...Array.from(y)];
  pooled.forEach((v, i) => {
    if (!Number.isFinite(v)) {
      throw new RangeError(i < m ? `x[${i}] must be finite` : `y[${i - m}] must be finite`);
    }
  });
  const { method = 'auto', continuity = true } = options;
  const { ranks, tieSizes } = averageRanks(pooled);
  let rankSumX = 0;
  for (let i = 0; i < m; i++) rankSumX += ranks[i]!;
  const u = rankSumX - (m * (m + 1)) / 2;
  const N = m + n;
  const variance = ((m * n) / 12) * (N + 1 - tieCubeSum(tieSizes) / (N * (N - 1)));
  const exact =
    method === 'exact' ||
    (method === 'auto' &&
      tieSizes.length === 0 &&
      m <= EXACT_MANN_WHITNEY_MAX &&
      n <= EXACT_MANN_WHITNEY_MAX);
  if (exact) {
    if (tieSizes.length > 0)
      throw new RangeError('x, y: the exact method needs samples without ties');
    const probabilities = mannWhitneyProbabilities(m, n);
    const lower = lowerTailFromProbabilities(probabilities, u);
    const upper = lowerTailFromProbabilities(probabilities, m * n - u); // U is symmetric about mn/2
    return {
      u,
      variance,
      method: 'exact',
      z: null,
      pValue: Math.min(1, 2 * Math.min(lower, upper)),
    };
  }
  const deviation = u - (m * n) / 2;
  const corrected = Math.max(0, Math.abs(deviation) - (continuity ? 0.5 : 0));
  const z = variance > 0 ? (Math.sign(deviation) * corrected) / Math.sqrt(variance) : 0;
  const pValue = Math.min(1, 2 * normalUpperTail(Math.abs(z)));
  return { u, variance, method: 'normal', z, pValue };
}
