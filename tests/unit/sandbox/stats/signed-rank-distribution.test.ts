import { describe, expect, it } from 'vitest';
import {
  lowerTailFromCounts,
  signedRankCounts,
  signedRankCountsUntied,
} from '@sandbox/stats/signed-rank-distribution.ts';

/** Brute force: the sum of the chosen scores for every one of the 2ⁿ subsets (sign patterns). */
function enumerateSums(scores: number[]): Map<number, number> {
  const counts = new Map<number, number>();
  for (let mask = 0; mask < 2 ** scores.length; mask++) {
    let s = 0;
    scores.forEach((v, i) => {
      if (mask & (1 << i)) s += v;
    });
    counts.set(s, (counts.get(s) ?? 0) + 1);
  }
  return counts;
}

function expectMatchesEnumeration(scores: number[]): void {
  const dp = signedRankCounts(scores);
  const brute = enumerateSums(scores);
  for (let t = 0; t < dp.length; t++) expect(dp[t]).toBe(brute.get(t) ?? 0);
}

describe('exact signed-rank null distribution', () => {
  it('matches brute-force enumeration of all sign patterns, ranks 1..n, n = 1..12', () => {
    for (let n = 1; n <= 12; n++)
      expectMatchesEnumeration(Array.from({ length: n }, (_, i) => i + 1));
  });

  it('matches enumeration with tied (doubled mid-)ranks and with a zero score', () => {
    // |d| = 0.1, 0.3, 0.3, 0.3, 0.7, 0.9, 0.9 → mid-ranks 1, 3, 3, 3, 5, 6.5, 6.5, doubled.
    expectMatchesEnumeration([2, 6, 6, 6, 10, 13, 13]);
    expectMatchesEnumeration([0, 2, 3, 3, 8]);
  });

  it('gives the hand-counted distribution for n = 3', () => {
    // Subsets of {1, 2, 3}: sums 0, 1, 2, 3 (twice: {3}, {1,2}), 4, 5, 6.
    expect(Array.from(signedRankCountsUntied(3))).toEqual([1, 1, 1, 2, 1, 1, 1]);
  });

  it('reproduces the tabled two-sided 5 % critical value for n = 10', () => {
    // Standard tables of the signed-rank test list T ≤ 8 as significant at two-sided 5 % for n = 10
    // (from memory): P(T⁺ ≤ 8) = 25/1024 ≤ 0.025 < P(T⁺ ≤ 9) = 33/1024.
    const counts = signedRankCountsUntied(10);
    expect(lowerTailFromCounts(counts, 10, 8)).toBe(25 / 1024);
    expect(lowerTailFromCounts(counts, 10, 9)).toBe(33 / 1024);
  });

  it('sums to 2ⁿ exactly and is symmetric about n(n+1)/4, up to n = 50', () => {
    const n = 50;
    const counts = signedRankCountsUntied(n);
    expect(counts.reduce((a, b) => a + b, 0)).toBe(2 ** n);
    const top = counts.length - 1;
    for (let t = 0; t <= top; t++) expect(counts[t]).toBe(counts[top - t]);
  });

  it('rejects non-integer scores and too many scores', () => {
    expect(() => signedRankCounts([1, 1.5])).toThrow(/scores\[1\]/);
    expect(() => signedRankCountsUntied(51)).toThrow(RangeError);
  });
});
