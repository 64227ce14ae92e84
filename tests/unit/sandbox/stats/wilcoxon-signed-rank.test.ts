import { describe, expect, it } from 'vitest';
import { averageRanks } from '@sandbox/stats/ranks.ts';
import { wilcoxonSignedRank } from '@sandbox/stats/wilcoxon-signed-rank.ts';

/**
 * Brute force of the permutation test: every sign pattern of the non-zero differences' ranks is
 * equally likely under H₀; p = 2·min(P(T⁺ ≤ t), P(T⁺ ≥ t)), capped at 1.
 */
function bruteForcePValue(d: number[], pratt: boolean): number {
  const used = pratt ? d : d.filter((v) => v !== 0);
  const ranks = Array.from(averageRanks(used.map(Math.abs)).ranks);
  const r = ranks.filter((_, i) => used[i] !== 0);
  const positive = used.filter((v) => v !== 0).map((v) => v > 0);
  const t = r.reduce((s, v, i) => s + (positive[i] ? v : 0), 0);
  let lower = 0;
  let upper = 0;
  for (let mask = 0; mask < 2 ** r.length; mask++) {
    const s = r.reduce((acc, v, i) => acc + (mask & (1 << i) ? v : 0), 0);
    if (s <= t + 1e-9) lower++;
    if (s >= t - 1e-9) upper++;
  }
  return Math.min(1, (2 * Math.min(lower, upper)) / 2 ** r.length);
}

// Invented differences with a tie (0.7 twice) and one zero.
const d = [0.5, -0.2, 1.3, 0.7, 2.1, -0.4, 0.9, 1.5, 0, 0.7];

describe('wilcoxonSignedRank', () => {
  it('matches SciPy 1.17 scipy.stats.wilcoxon on the invented sample [computed]', () => {
    // wilcoxon(d, zero_method='wilcox', method='exact') → p = 0.01953125;
    // method='approx', correction=True → 0.024265276173783466; zero_method='pratt',
    // method='approx', correction=True → 0.028108799449939586 (tie- and zero-corrected variance).
    expect(wilcoxonSignedRank(d).pValue).toBeCloseTo(0.01953125, 14);
    expect(wilcoxonSignedRank(d, { method: 'normal' }).pValue).toBeCloseTo(
      0.024265276173783466,
      12,
    );
    expect(wilcoxonSignedRank(d, { method: 'normal', zeroMethod: 'pratt' }).pValue).toBeCloseTo(
      0.028108799449939586,
      12,
    );
  });

  it('reports T⁺, the zeros and the number of non-zero differences', () => {
    // Without the zero, |d| ranks: 0.2→1, 0.4→2, 0.5→3, 0.7→4.5 (twice), 0.9→6, 1.3→7, 1.5→8, 2.1→9;
    // T⁺ = 45 − (1 + 2) = 42.
    const result = wilcoxonSignedRank(d);
    expect(result).toMatchObject({ statistic: 42, nonZero: 9, zeros: 1, method: 'exact' });
    // Pratt ranks the zero first, so every other rank grows by 1: T⁺ = 42 + 7 = 49.
    expect(wilcoxonSignedRank(d, { zeroMethod: 'pratt' }).statistic).toBe(49);
  });

  it('gives exact p-values equal to brute-force enumeration, with ties and zeros', () => {
    const samples = [
      [1.2, -0.4, 2.2, 0.9, -1.1, 3.4],
      [0.3, 0.3, -0.3, 0.8, -0.8, 0.8, 1.1, 0],
      [2, 0, 0, -1, 3, 3, -3, 4, 5, -0.5, 6],
    ];
    for (const sample of samples) {
      for (const pratt of [false, true]) {
        const zeroMethod = pratt ? 'pratt' : 'wilcox';
        expect(wilcoxonSignedRank(sample, { zeroMethod }).pValue).toBeCloseTo(
          bruteForcePValue(sample, pratt),
          14,
        );
      }
    }
  });

  it('uses the untied moments n(n+1)/4 and n(n+1)(2n+1)/24 beyond n = 50', () => {
    // Invented: differences 1..60 with every third one negative (no ties, no zeros).
    const big = Array.from({ length: 60 }, (_, i) => (i % 3 === 0 ? -(i + 1) : i + 1));
    const result = wilcoxonSignedRank(big);
    const t = big.filter((v) => v > 0).reduce((s, v) => s + v, 0); // ranks equal |d| here
    const n = 60;
    const z = (t - (n * (n + 1)) / 4 - 0.5) / Math.sqrt((n * (n + 1) * (2 * n + 1)) / 24);
    expect(result.method).toBe('normal');
    expect(result.statistic).toBe(t);
    expect(result.z).toBeCloseTo(z, 12);
  });

  it('gives p = 1 when every difference is zero, and p ≤ 1 always', () => {
    expect(wilcoxonSignedRank([0, 0, 0]).pValue).toBe(1);
    expect(wilcoxonSignedRank([1, -1]).pValue).toBe(1);
  });

  it('rejects non-finite differences', () => {
    expect(() => wilcoxonSignedRank([1, Infinity])).toThrow(/d\[1\]/);
  });
});
