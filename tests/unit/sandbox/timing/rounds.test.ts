import { describe, expect, it } from 'vitest';
import {
  chooseRounds,
  chooseWarmup,
  chooseWarmupInWarmIsolate,
  DEFAULT_BLOCKS,
  MAX_BLOCK_ROUNDS,
  MAX_ROUNDS,
  MAX_WARMUP,
  MIN_ROUNDS,
  MIN_WARMUP,
} from '@sandbox/timing/rounds.ts';

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
  it('uses 8 blocks, whose rounds together stay within the bound of a single run', () => {
    // 8 is the fewest blocks whose smallest two-sided exact signed-rank p-value, 2/2^8, lies
    // below 0.05/6 (Benjamini–Hochberg with one clear size among six).
    expect(DEFAULT_BLOCKS).toBe(8);
    expect(2 / 2 ** DEFAULT_BLOCKS).toBeLessThan(0.05 / 6);
    expect(2 / 2 ** (DEFAULT_BLOCKS - 1)).toBeGreaterThan(0.05 / 6);
    expect(DEFAULT_BLOCKS * MAX_BLOCK_ROUNDS).toBeGreaterThanOrEqual(MAX_ROUNDS);
    expect(DEFAULT_BLOCKS * (MAX_BLOCK_ROUNDS - 1)).toBeLessThan(MAX_ROUNDS);
  });
});
