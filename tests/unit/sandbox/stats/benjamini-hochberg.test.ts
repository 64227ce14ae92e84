import { describe, expect, it } from 'vitest';
import { benjaminiHochberg } from '@sandbox/stats/benjamini-hochberg.ts';

// Hand-worked with the step-up rule of Benjamini & Hochberg (1995): reject H_(1..k), k the largest
// i with p_(i) ≤ i·q/m; adjusted p̃_(i) = min_{j ≥ i} m·p_(j)/j.
describe('benjaminiHochberg', () => {
  it('m = 5, q = 0.05: rejects four (hand-worked)', () => {
    // Sorted p: 0.005, 0.01, 0.03, 0.039, 0.2 against 0.01, 0.02, 0.03, 0.04, 0.05 → k = 4.
    // m·p/i: 0.025, 0.025, 0.05, 0.04875, 1.0·0.2 → running minimum from the top:
    // 0.025, 0.025, 0.04875, 0.04875, 0.2.
    const { adjusted, rejected } = benjaminiHochberg([0.01, 0.039, 0.03, 0.005, 0.2]);
    const expected = [0.025, 0.04875, 0.04875, 0.025, 0.2];
    adjusted.forEach((p, i) => expect(p).toBeCloseTo(expected[i]!, 14));
    expect(rejected).toEqual([true, true, true, true, false]);
  });

  it('steps up past a p-value above its own threshold (hand-worked)', () => {
    // m = 4: thresholds 0.0125, 0.025, 0.0375, 0.05. p_(2) = 0.03 > 0.025, but p_(3) = 0.036 ≤
    // 0.0375, so H_(1..3) are all rejected.
    const { rejected } = benjaminiHochberg([0.9, 0.036, 0.001, 0.03]);
    expect(rejected).toEqual([false, true, true, true]);
  });

  it('is the identity for one p-value and caps at 1', () => {
    expect(benjaminiHochberg([0.04]).adjusted).toEqual([0.04]);
    expect(benjaminiHochberg([0.9, 0.8]).adjusted).toEqual([0.9, 0.9]);
    expect(benjaminiHochberg([])).toEqual({ adjusted: [], rejected: [] });
  });

  it('rejects p-values outside [0, 1] and a bad q', () => {
    expect(() => benjaminiHochberg([0.1, 1.2])).toThrow(/pValues\[1\]/);
    expect(() => benjaminiHochberg([0.1], 0)).toThrow(/q must/);
  });
});
