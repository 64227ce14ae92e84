import { describe, expect, it } from 'vitest';
import { averageRanks, tieCubeSum } from '@sandbox/stats/ranks.ts';

describe('averageRanks', () => {
  it('ranks distinct values 1..n in ascending order, whatever the input order', () => {
    const { ranks, tieSizes } = averageRanks([30, 10, 20]);
    expect(Array.from(ranks)).toEqual([3, 1, 2]);
    expect(tieSizes).toEqual([]);
  });

  it('gives tied values the mean of the ranks they occupy (hand-worked)', () => {
    // Sorted: 1 | 2 2 2 | 5 5 | 9 → ranks 1 | (2+3+4)/3 = 3 | (5+6)/2 = 5.5 | 7.
    const { ranks, tieSizes } = averageRanks([5, 2, 9, 2, 1, 5, 2]);
    expect(Array.from(ranks)).toEqual([5.5, 3, 7, 3, 1, 5.5, 3]);
    expect(tieSizes.sort()).toEqual([2, 3]);
    // The ranks always sum to n(n+1)/2.
    expect(ranks.reduce((a, b) => a + b, 0)).toBe(28);
  });

  it('handles the empty sample and rejects NaN', () => {
    expect(averageRanks([]).ranks.length).toBe(0);
    expect(() => averageRanks([1, NaN])).toThrow(TypeError);
  });
});

describe('tieCubeSum', () => {
  it('sums t³ − t over the tie groups', () => {
    expect(tieCubeSum([2, 3])).toBe(6 + 24);
    expect(tieCubeSum([])).toBe(0);
  });
});
