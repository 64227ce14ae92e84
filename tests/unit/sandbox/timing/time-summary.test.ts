import { describe, expect, it } from 'vitest';
import { summariseTimes } from '@sandbox/timing/time-summary.ts';

describe('summariseTimes', () => {
  it('reports minimum and type 7 quartiles (hand-worked)', () => {
    // Sorted 1 2 3 4 5 6 7 8 9: h = 2, 4, 6 for p = ¼, ½, ¾.
    expect(summariseTimes([9, 1, 8, 2, 7, 3, 6, 4, 5])).toEqual({
      minMs: 1,
      q1Ms: 3,
      medianMs: 5,
      q3Ms: 7,
    });
  });

  it('rejects an empty list', () => {
    expect(() => summariseTimes([])).toThrow(RangeError);
  });
});
