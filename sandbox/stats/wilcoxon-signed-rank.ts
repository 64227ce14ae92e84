import { normalUpperTail } from '@sandbox/stats/normal.ts';
import { averageRanks } from '@sandbox/stats/ranks.ts';
import {
  EXACT_SIGNED_RANK_MAX_N,
  signedRankCounts,
} from '@sandbox/stats/signed-rank-distribution.ts';

/**
 * Wilcoxon's signed-rank test of H₀ "the differences d_i are symmetric about 0", two-sided
 * (F. Wilcoxon, Biometrics Bulletin 1 (1945) 80–83; Hollander, Wolfe & Chicken, Nonparametric
 * Statistical Methods, 3rd ed., 2014, §3.1, from memory).
 */

/**
 * Zero differences: 'wilcox' drops them before ranking (Wilcoxon 1945); 'pratt' ranks them with
 * the others and then drops them (J. W. Pratt, JASA 54 (1959) 655–667, from memory).
 */
export type ZeroMethod = 'wilcox' | 'pratt';

export interface SignedRankOptions {
  zeroMethod?: ZeroMethod;
  /** 'auto' (default): exact when at most EXACT_SIGNED_RANK_MAX_N non-zero differences. */
  method?: 'auto' | 'exact' | 'normal';
  /** Continuity correction ½ in the normal approximation (default true). */
  continuity?: boolean;
}

export interface SignedRankTest {
  /** T⁺: the sum of the (mid-)ranks of |d_i| over the positive d_i. */
  statistic: number;
  /** Differences that take part (non-zero). */
  nonZero: number;
  zeros: number;
  method: 'exact' | 'normal';
  /** Standardised statistic (normal method only), signed like T⁺ − E T⁺. */
  z: number | null;
  pValue: number;
}

/** The ranks of |d_i| for the non-zero d_i, and their signs, after the chosen zero treatment. */
function signedRanks(d: ArrayLike<number>, zeroMethod: ZeroMethod) {
  const all = Array.from(d);
  const used = zeroMethod === 'wilcox' ? all.filter((v) => v !== 0) : all;
  const { ranks } = averageRanks(used.map(Math.abs));
  const r: number[] = [];
  const positive: boolean[] = [];
  used.forEach((v, i) => {
    if (v !== 0) {
      r.push(ranks[i]!);
      positive.push(v > 0);
    }
  });
  return { r, positive, zeros: all.length - r.length };
}

/**
 * Two-sided signed-rank test on the differences `d` (for paired data, d_i = x_i − y_i).
 * Exact: the permutation distribution of T⁺ given the ranks (all 2ⁿ sign patterns), by dynamic
 * programming on doubled mid-ranks, so ties and Pratt's zeros are handled exactly. Normal: with
 * E T⁺ = ½Σr_i and Var T⁺ = ¼Σr_i², the conditional moments given the ranks, which equal
 * n(n+1)/4 and n(n+1)(2n+1)/24 − Σ(t³ − t)/48 without zeros (HWC §3.1, from memory).
 * p = min(1, 2·min(P(T⁺ ≤ t), P(T⁺ ≥ t))). Cost O(n log n), exact O(n³).
 * Throws RangeError when an entry of d is not finite.
 */
export function wilcoxonSignedRank(
  d: ArrayLike<number>,
  options: SignedRankOptions = {},
): SignedRankTest {
  for (let i = 0; i < d.length; i++) {
    if (!Number.isFinite(d[i]!)) throw new RangeError(`d[${i}] must be finite, got ${d[i]}`);
  }
  const { zeroMethod = 'wilcox', method = 'auto', continuity = true } = options;
  const { r, positive, zeros } = signedRanks(d, zeroMethod);
  const n = r.length;
  let statistic = 0;
  for (let i = 0; i < n; i++) if (positive[i]) statistic += r[i]!;
  const exact = method === 'exact' || (method === 'auto' && n <= EXACT_SIGNED_RANK_MAX_N);
  if (n === 0)
    return { statistic, nonZero: 0, zeros, method: exact ? 'exact' : 'normal', z: null, pValue: 1 };
  if (exact) {
    // Mid-ranks are multiples of ½, so doubled ranks are integers.
    const counts = signedRankCounts(r.map((v) => 2 * v));
    const t = Math.round(2 * statistic);
    let lower = 0;
    let upper = 0;
    for (let s = 0; s < counts.length; s++) {
      if (s <= t) lower += counts[s]!;
      if (s >= t) upper += counts[s]!;
    }
    const pValue = Math.min(1, (2 * Math.min(lower, upper)) / 2 ** n);
    return { statistic, nonZero: n, zeros, method: 'exact', z: null, pValue };
  }
  let sumR = 0;
  let sumR2 = 0;
  for (const v of r) {
    sumR += v;
    sumR2 += v * v;
  }
  const deviation = statistic - sumR / 2;
  const corrected = Math.max(0, Math.abs(deviation) - (continuity ? 0.5 : 0));
  const z = (Math.sign(deviation) * corrected) / Math.sqrt(sumR2 / 4);
  const pValue = Math.min(1, 2 * normalUpperTail(Math.abs(z)));
  return { statistic, nonZero: n, zeros, method: 'normal', z, pValue };
}
