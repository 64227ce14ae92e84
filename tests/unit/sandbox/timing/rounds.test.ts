import { describe, expect, it } from 'vitest';
import {
  chooseRounds,
  chooseWarmup,
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
