import { describe, expect, it } from 'vitest';
import { pairwiseDifferences } from '@sandbox/stats/pairwise-differences.ts';
import { walshAverages } from '@sandbox/stats/walsh-averages.ts';

describe('walshAverages', () => {
  it('lists (x_i + x_j)/2 for i ≤ j, sorted (hand-worked)', () => {
    // x = (1, 3, 8): 1, 2, 4.5, 3, 5.5, 8 → sorted.
    expect(Array.from(walshAverages([1, 3, 8]))).toEqual([1, 2, 3, 4.5, 5.5, 8]);
  });

  it('has n(n+1)/2 entries and #positive = T⁺ (Tukey; HWC §3.2, from memory)', () => {
    // For distinct |d| and no zeros, the number of positive Walsh averages equals the signed-rank
    // statistic T⁺. Invented d: |d| ranks 0.4→1, 0.6→2, 1.5→3, 2→4, 3→5; T⁺ = 1 + 3 + 4 + 5 = 13.
    const d = [1.5, -0.6, 2, 0.4, 3];
    const w = walshAverages(d);
    expect(w.length).toBe(15);
    expect(w.filter((v) => v > 0).length).toBe(13);
  });

  it('rejects non-finite entries', () => {
    expect(() => walshAverages([1, NaN])).toThrow(/x\[1\]/);
  });
});

describe('pairwiseDifferences', () => {
  it('lists x_i − y_j, sorted (hand-worked)', () => {
    expect(Array.from(pairwiseDifferences([5, 1], [2, 0, 1]))).toEqual([-1, 0, 1, 3, 4, 5]);
  });

  it('counts #(x_i > y_j) = U_x among the positive differences', () => {
    const x = [1.021, 1.003, 1.048, 0.991, 1.012, 1.197, 1.034, 1.006];
    const y = [0.951, 0.932, 0.962, 0.973, 0.944, 1.102, 0.957, 0.968];
    // U_A = 57 for this pair (numerics-references §8.5).
    expect(pairwiseDifferences(x, y).filter((v) => v > 0).length).toBe(57);
  });

  it('rejects non-finite entries', () => {
    expect(() => pairwiseDifferences([1], [Infinity])).toThrow(/y\[0\]/);
  });
});
