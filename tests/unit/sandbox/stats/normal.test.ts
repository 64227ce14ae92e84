import { describe, expect, it } from 'vitest';
import {
  acklamLowerHalf,
  normalCdf,
  normalDensity,
  normalInverseCdf,
  normalUpperTail,
} from '@sandbox/stats/normal.ts';

// Reference values of Φ: standard normal tables (from memory), here as the doubles nearest to the values
// computed with mpmath at 40 digits (mp.ncdf) [computed]. (SciPy 1.17's norm.cdf(-37) is off by
// 1.1e-13 relative, so it is not used as the reference there.)
const cdfValues: [number, number][] = [
  [0, 0.5],
  [1, 0.8413447460685429],
  [0.5, 0.6914624612740131],
  [1.959963984540054, 0.975],
  [-1.6448536269514722, 0.05000000000000005],
  [-2.5, 0.006209665325776135],
  [2.5, 0.9937903346742238],
  [-3, 0.0013498980316300946],
  [-5, 2.866515718791939e-7],
  [-10, 7.619853024160525e-24],
  [-20, 2.7536241186062337e-89],
  [-37, 5.725571222524577e-300],
];

describe('normalCdf', () => {
  it.each(cdfValues)('Φ(%d) matches the table value to 1e-14 relative', (x, expected) => {
    expect(Math.abs(normalCdf(x) - expected) / expected).toBeLessThan(1e-14);
  });

  it('is symmetric, Φ(x) + Φ(−x) = 1, on both sides of the series/fraction switch', () => {
    for (const x of [0.3, 1.7, 2.4999, 2.5, 2.5001, 4, 7]) {
      expect(normalCdf(x) + normalCdf(-x)).toBeCloseTo(1, 15);
    }
  });

  it('is continuous and increasing across the switch at 2.5', () => {
    const below = normalCdf(-2.5 - 1e-9);
    const at = normalCdf(-2.5);
    const above = normalCdf(-2.5 + 1e-9);
    expect(below).toBeLessThan(at);
    expect(at).toBeLessThan(above);
    // dΦ/dx = φ(2.5) ≈ 0.0175, so a 1e-9 step moves Φ by ≈ 1.75e-11.
    expect((above - below) / 2e-9).toBeCloseTo(normalDensity(2.5), 6);
  });

  it('handles the infinities and NaN', () => {
    expect(normalCdf(Infinity)).toBe(1);
    expect(normalCdf(-Infinity)).toBe(0);
    expect(normalCdf(NaN)).toBeNaN();
  });

  it('gives the upper tail without cancellation', () => {
    // 1 − Φ(10) = Φ(−10) (symmetry); in double, 1 − normalCdf(10) would be 0.
    expect(normalUpperTail(10) / 7.619853024160525e-24).toBeCloseTo(1, 12);
  });
});

describe('normalInverseCdf', () => {
  // Quantiles z_p from standard tables (from memory), as the doubles nearest to the roots of
  // mpmath's ncdf at 40 digits [computed].
  const quantiles: [number, number][] = [
    [0.975, 1.9599639845400543],
    [0.95, 1.6448536269514726],
    [0.9, 1.2815515655446006],
    [0.001, -3.0902323061678136],
    [1e-10, -6.361340902404057],
    [1e-300, -37.0470962993612],
  ];

  it.each(quantiles)('Φ⁻¹(%d) matches the table value to 1e-14 relative', (p, expected) => {
    expect(Math.abs(normalInverseCdf(p) - expected) / Math.abs(expected)).toBeLessThan(1e-14);
  });

  it('is 0 at ½, ±∞ at the ends, and inverts normalCdf', () => {
    expect(normalInverseCdf(0.5)).toBe(0);
    expect(normalInverseCdf(0)).toBe(-Infinity);
    expect(normalInverseCdf(1)).toBe(Infinity);
    for (const x of [-8, -3.3, -1, -0.01, 0.2, 1.5, 3.9]) {
      expect(normalInverseCdf(normalCdf(x))).toBeCloseTo(x, 12);
    }
  });

  it("keeps Acklam's raw approximation within its published 1.15e-9 relative error", () => {
    // Acklam (2003) states a relative error below 1.15e-9 over (0, 1) (from memory); a wrong
    // coefficient would show here as a much larger error.
    for (let p = 1e-12; p <= 0.5; p *= 1.37) {
      const exact = normalInverseCdf(p);
      expect(Math.abs(acklamLowerHalf(p) - exact) / Math.abs(exact)).toBeLessThan(1.2e-9);
    }
  });

  it('rejects p outside [0, 1]', () => {
    expect(() => normalInverseCdf(-0.1)).toThrow(RangeError);
    expect(() => normalInverseCdf(1.5)).toThrow(/p must lie/);
    expect(() => normalInverseCdf(NaN)).toThrow(RangeError);
  });
});
