import { describe, expect, it } from 'vitest';
import {
  chooseRounds,
  chooseWarmup,
  chooseWarmupInWarmIsolate,
  DEFAULT_BLOCKS,
  MAX_BLOCK_ROUNDS,
  MAX_ROUNDS,
  MAX_WARMUP,
  MIN_BLOCK_ROUNDS,
  MIN_ROUNDS,
  MIN_WARMUP,
} from '@sandbox/timing/rounds.ts';
import { wilcoxonSignedRank } from '@sandbox/stats/wilcoxon-signed-rank.ts';

describe('chooseRounds', () => {
  it('fits ⌊budget/round⌋ rounds between the bounds 11 and 201', () => {
    expect(MIN_ROUNDS).toBe(11);
    expect(MAX_ROUNDS).toBe(201);
    expect(chooseRounds({ budgetMs: 1000, roundMs: 10 })).toBe(100);
    expect(chooseRounds({ budgetMs: 1000, roundMs: 300 })).toBe(11); // the minimum wins
    expect(chooseRounds({ budgetMs: 1000, roundMs: 0.1 })).toBe(201);
    expect(chooseRounds({ budgetMs: 0, roundMs: 0 })).toBe(201);
    expect(chooseRounds({ budgetMs: 100, roundMs: 1, minRounds: 3, maxRounds: 50 })).toBe(50);
  });

  it('gives more rounds at small n for the same budget', () => {
    const small = chooseRounds({ budgetMs: 2000, roundMs: 2 * 0.05 });
    const large = chooseRounds({ budgetMs: 2000, roundMs: 2 * 40 });
    expect(small).toBeGreaterThan(large);
  });

  it('rejects bad budgets, round times and bounds', () => {
    expect(() => chooseRounds({ budgetMs: -1, roundMs: 1 })).toThrow(/budgetMs/);
    expect(() => chooseRounds({ budgetMs: 1, roundMs: NaN })).toThrow(/roundMs/);
    expect(() => chooseRounds({ budgetMs: 1, roundMs: 1, minRounds: 0 })).toThrow(/minRounds/);
    expect(() => chooseRounds({ budgetMs: 1, roundMs: 1, minRounds: 5, maxRounds: 4 })).toThrow(
      /maxRounds/,
    );
  });
});

describe('chooseWarmup', () => {
  it('covers about 100 ms of calls, between 5 and 30 calls', () => {
    expect([MIN_WARMUP, MAX_WARMUP]).toEqual([5, 30]);
    expect(chooseWarmup(10)).toBe(10);
    expect(chooseWarmup(0.5)).toBe(30);
    expect(chooseWarmup(0)).toBe(30);
    expect(chooseWarmup(60)).toBe(5);
    expect(() => chooseWarmup(-1)).toThrow(/firstCallMs/);
  });
});

describe('chooseWarmupInWarmIsolate', () => {
  it('covers about 20 ms of calls, between 1 and 5 calls', () => {
    expect(chooseWarmupInWarmIsolate(100)).toBe(1);
    expect(chooseWarmupInWarmIsolate(10)).toBe(2);
    expect(chooseWarmupInWarmIsolate(0.5)).toBe(5);
    expect(chooseWarmupInWarmIsolate(0)).toBe(5);
    expect(() => chooseWarmupInWarmIsolate(Number.NaN)).toThrow(/firstCallMs/);
  });
});

describe('blocks', () => {
  it('are enough that one clear size survives BH over six sizes with one stray block', () => {
    // Eleven blocks slower, the block nearest zero faster: the exact two-sided signed-rank p-value
    // is 2·2/2^B (sign patterns with rank sum ≥ the observed one: all positive, or only rank 1
    // negative), which must lie below 0.05/6 (Benjamini–Hochberg with one clear size among six).
    const estimates = Array.from({ length: DEFAULT_BLOCKS }, (_, i) => 0.01 * (i + 1));
    estimates[0] = -estimates[0]!;
    const { pValue } = wilcoxonSignedRank(estimates);
    expect(pValue).toBeCloseTo(4 / 2 ** DEFAULT_BLOCKS, 12);
    expect(pValue).toBeLessThan(0.05 / 6);
    // With 8 blocks, the earlier default, the same pattern did not survive.
    const eight = estimates.slice(0, 8);
    expect(wilcoxonSignedRank(eight).pValue).toBeGreaterThan(0.05 / 6);
  });

  it('allow enough rounds per block at small n and at least one at large n', () => {
    expect(MIN_BLOCK_ROUNDS).toBe(1);
    expect(MAX_BLOCK_ROUNDS).toBeGreaterThanOrEqual(MAX_ROUNDS / DEFAULT_BLOCKS);
  });
});
