import { describe, expect, it } from 'vitest';
import {
  mannWhitneyIntervalIndex,
  signedRankIntervalIndex,
} from '@sandbox/stats/rank-interval-index.ts';

describe('mannWhitneyIntervalIndex', () => {
  it('m = n = 8, α = 0.05: exact k = 14, coverage 0.9501166; normal k = 13 (§8.5)', () => {
    const exact = mannWhitneyIntervalIndex(8, 8, 0.05);
    expect(exact.k).toBe(14);
    expect(exact.method).toBe('exact');
    expect(exact.coverage).toBeCloseTo(0.9501166, 7);
    // SciPy's exact two-sided p at U = 13 is 0.0498834 = 1 − coverage (§8.5).
    expect(1 - exact.coverage).toBeCloseTo(0.0498834, 7);
    expect(mannWhitneyIntervalIndex(8, 8, 0.05, 'normal').k).toBe(13);
  });

  it('gives k = 0 when the samples are too small for the confidence', () => {
    // P₀(U = 0) = 1/C(4, 2) = 1/6 > 0.025 for 2 vs 2.
    expect(mannWhitneyIntervalIndex(2, 2, 0.05)).toMatchObject({ k: 0, coverage: 1 });
  });

  it('switches to the normal approximation beyond 50 and rejects bad sizes', () => {
    expect(mannWhitneyIntervalIndex(60, 60, 0.05).method).toBe('normal');
    expect(() => mannWhitneyIntervalIndex(0, 3, 0.05)).toThrow(/m must/);
    expect(() => mannWhitneyIntervalIndex(3, 3, 1.5)).toThrow(/alpha/);
  });
});

describe('signedRankIntervalIndex', () => {
  it('n = 10: k = 9 with coverage 1 − 2·25/1024 (tabled critical value 8, from memory)', () => {
    const index = signedRankIntervalIndex(10, 0.05);
    expect(index.k).toBe(9);
    expect(index.coverage).toBe(1 - (2 * 25) / 1024);
  });

  it('needs n ≥ 6 at 95 %: P(T⁺ = 0) = 2⁻ⁿ must not exceed 0.025', () => {
    expect(signedRankIntervalIndex(5, 0.05).k).toBe(0); // 1/32 > 0.025
    expect(signedRankIntervalIndex(6, 0.05)).toMatchObject({ k: 1, coverage: 1 - 2 / 64 });
  });

  it('exact and normal approximations agree closely at n = 50', () => {
    const exact = signedRankIntervalIndex(50, 0.05);
    const normal = signedRankIntervalIndex(50, 0.05, 'normal');
    expect(Math.abs(exact.k - normal.k)).toBeLessThanOrEqual(1);
    expect(exact.coverage).toBeGreaterThanOrEqual(0.95);
    expect(normal.coverage).toBeCloseTo(0.95, 2);
  });
});
