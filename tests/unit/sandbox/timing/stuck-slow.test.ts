import { describe, expect, it } from 'vitest';
import { isStuckSlow, STUCK_SLOW_FACTOR } from '@sandbox/timing/stuck-slow.ts';

// Invented time series in ms; the hazard being modelled is stack.md's (stuck 1.4–2× slower).
describe('isStuckSlow', () => {
  const steady = [1.0, 1.02, 0.99, 1.01, 1.03, 1.0, 0.98, 1.02];

  it('does not flag a steady kernel, nor one occasional spike', () => {
    expect(isStuckSlow([1.01, 1.0], steady)).toBe(false);
    expect(isStuckSlow([1.01, 1.0], [...steady.slice(0, 6), 5, 1.0])).toBe(false);
  });

  it('flags a kernel fast in warm-up that stays 1.8× slower', () => {
    expect(
      isStuckSlow(
        [1.0, 0.99],
        steady.map((t) => 1.8 * t),
      ),
    ).toBe(true);
  });

  it('flags a kernel that drops to the slow level half-way through the rounds', () => {
    expect(
      isStuckSlow([1.0], [...steady.slice(0, 4), ...steady.slice(4).map((t) => 1.6 * t)]),
    ).toBe(true);
  });

  it('does not flag a kernel that speeds up during the rounds (late optimisation)', () => {
    expect(isStuckSlow([2.0, 2.0], [2.0, 1.9, 1.1, 1.0, 1.0, 1.01, 0.99, 1.0])).toBe(false);
  });

  it('stays silent with fewer than 4 rounds and rejects a factor ≤ 1', () => {
    expect(isStuckSlow([1.0], [2, 2, 2])).toBe(false);
    expect(STUCK_SLOW_FACTOR).toBeGreaterThan(1);
    expect(() => isStuckSlow([1], steady, 1)).toThrow(/factor/);
  });
});
