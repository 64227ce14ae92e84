import {
  EXACT_MANN_WHITNEY_MAX,
  mannWhitneyProbabilities,
} from '@sandbox/stats/mann-whitney-distribution.ts';
import { normalCdf, normalInverseCdf } from '@sandbox/stats/normal.ts';
import {
  EXACT_SIGNED_RANK_MAX_N,
  signedRankCountsUntied,
} from '@sandbox/stats/signed-rank-distribution.ts';

/**
 * The order-statistic index k of the distribution-free confidence intervals for a location or
 * shift: the interval is [W_(k), W_(M+1−k)] of the M sorted Walsh averages (one sample, M = n(n+1)/2;
 * Bauer, JASA 67 (1972) 687–690; Hollander, Wolfe & Chicken, 3rd ed., 2014, §3.3, from memory) or
 * pairwise differences (two samples, M = mn; Moses; Lehmann 1975 §2.6; HWC §4.3, from memory).
 * k is the largest integer with P₀(S ≤ k − 1) ≤ α/2, S the signed-rank or Mann–Whitney statistic;
 * the exact coverage for continuous data is then 1 − 2·P₀(S ≤ k − 1) (numerics-references §8.2).
 */
export interface IntervalIndex {
  /** 1-based index; 0 when no k ≥ 1 qualifies (the sample is too small for this confidence). */
  k: number;
  /** 1 − 2·P₀(S ≤ k − 1): exact, or its normal approximation with continuity correction. */
  coverage: number;
  method: 'exact' | 'normal';
}

/** Largest k with cdf(k − 1) ≤ α/2, scanning the cumulative distribution of S over 0..M. */
function indexFromProbabilities(probabilities: ArrayLike<number>, alpha: number): IntervalIndex {
  let cumulative = 0; // P₀(S ≤ k − 1) for the current candidate k
  let k = 0;
  let tail = 0;
  for (let s = 0; s < probabilities.length; s++) {
    const next = cumulative + probabilities[s]!;
    if (next > alpha / 2) break;
    cumulative = next;
    k = s + 1;
    tail = cumulative;
  }
  return { k, coverage: k === 0 ? 1 : 1 - 2 * tail, method: 'exact' };
}

/**
 * Normal approximation k = ⌊M/2 − z_{α/2}·σ⌋ with σ the null standard deviation of S
 * (numerics-references §8.2); coverage 1 − 2Φ((k − ½ − M/2)/σ).
 */
function indexFromNormal(mean: number, sd: number, alpha: number): IntervalIndex {
  const z = normalInverseCdf(1 - alpha / 2);
  const k = Math.max(0, Math.floor(mean - z * sd));
  return { k, coverage: k === 0 ? 1 : 1 - 2 * normalCdf((k - 0.5 - mean) / sd), method: 'normal' };
}

function checkAlpha(alpha: number): void {
  if (!(alpha > 0 && alpha < 1)) throw new RangeError(`alpha must lie in (0, 1), got ${alpha}`);
}

/**
 * k for the one-sample (signed-rank) interval of n observations at level 1 − α. Exact for
 * n ≤ EXACT_SIGNED_RANK_MAX_N unless method = 'normal'. Cost O(n³) exact, O(1) normal.
 */
export function signedRankIntervalIndex(
  n: number,
  alpha: number,
  method: 'auto' | 'exact' | 'normal' = 'auto',
): IntervalIndex {
  if (!Number.isInteger(n) || n < 1) throw new RangeError(`n must be a positive integer, got ${n}`);
  checkAlpha(alpha);
  if (method === 'exact' || (method === 'auto' && n <= EXACT_SIGNED_RANK_MAX_N)) {
    const counts = signedRankCountsUntied(n);
    const total = 2 ** n;
    return indexFromProbabilities(
      Array.from(counts, (c) => c / total),
      alpha,
    );
  }
  // E T⁺ = n(n+1)/4, Var T⁺ = n(n+1)(2n+1)/24 (HWC §3.1, from memory).
  return indexFromNormal((n * (n + 1)) / 4, Math.sqrt((n * (n + 1) * (2 * n + 1)) / 24), alpha);
}

/**
 * k for the two-sample (Mann–Whitney) interval of samples of sizes m and n at level 1 − α. Exact
 * for m, n ≤ EXACT_MANN_WHITNEY_MAX unless method = 'normal'. Cost O(m²n²) exact, O(1) normal.
 */
export function mannWhitneyIntervalIndex(
  m: number,
  n: number,
  alpha: number,
  method: 'auto' | 'exact' | 'normal' = 'auto',
): IntervalIndex {
  if (!Number.isInteger(m) || m < 1) throw new RangeError(`m must be a positive integer, got ${m}`);
  if (!Number.isInteger(n) || n < 1) throw new RangeError(`n must be a positive integer, got ${n}`);
  checkAlpha(alpha);
  if (
    method === 'exact' ||
    (method === 'auto' && m <= EXACT_MANN_WHITNEY_MAX && n <= EXACT_MANN_WHITNEY_MAX)
  ) {
    return indexFromProbabilities(mannWhitneyProbabilities(m, n), alpha);
  }
  // E U = mn/2, Var U = mn(m+n+1)/12 (numerics-references §8.1, no ties).
  return indexFromNormal((m * n) / 2, Math.sqrt((m * n * (m + n + 1)) / 12), alpha);
}
