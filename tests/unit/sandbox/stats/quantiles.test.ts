import { describe, expect, it } from 'vitest';
import { median, quantile, quantileSorted, quartiles } from '@sandbox/stats/quantiles.ts';

// Hyndman & Fan (1996) type 7, the default of R's quantile() and NumPy's percentile(); the values
// below are worked by hand from h = (n − 1)p.
describe('type 7 quantiles', () => {
  it('interpolates between order statistics', () => {
    const x = [7, 1, 3, 5]; // sorted 1 3 5 7
    expect(quantile(x, 0.25)).toBe(2.5); // h = 0.75: 1 + 0.75·(3 − 1)
    expect(quantile(x, 0.75)).toBe(5.5); // h = 2.25: 5 + 0.25·(7 − 5)
    expect(quantile(x, 0)).toBe(1);
    expect(quantile(x, 1)).toBe(7);
  });

  it('gives the ordinary median for odd and even n', () => {
    expect(median([3, 1, 2])).toBe(2);
    expect(median([4, 1, 3, 2])).toBe(2.5);
    expect(median([42])).toBe(42);
  });

  it('returns quartiles consistent with single quantiles and leaves the input alone', () => {
    const x = [9, 2, 6, 4, 8, 1, 7];
    const copy = [...x];
    expect(quartiles(x)).toEqual({ q1: quantile(x, 0.25), median: 6, q3: quantile(x, 0.75) });
    expect(quartiles(x).q1).toBe(3); // h = 1.5 on 1 2 4 6 7 8 9: 2 + 0.5·(4 − 2)
    expect(x).toEqual(copy);
  });

  it('rejects an empty sample and p outside [0, 1]', () => {
    expect(() => quantileSorted([], 0.5)).toThrow(RangeError);
    expect(() => quantile([1, 2], 1.1)).toThrow(/p must lie/);
  });
});
