import { describe, expect, it } from 'vitest';
import { forwardError, forwardErrorOverBound } from '@sandbox/metrics/forward-error.ts';
import { UNIT_ROUNDOFF } from '@sandbox/numerics/unit-roundoff.ts';

describe('forwardError', () => {
  it('is ‖x̂ − x_ref‖∞ / ‖x_ref‖∞ on hand cases', () => {
    // Hand: x̂ = (1, 2.5), x_ref = (1, 2): 0.5/2 = 0.25 (all exact in binary).
    expect(forwardError(Float64Array.of(1, 2.5), Float64Array.of(1, 2))).toBe(0.25);
    // Hand: x̂ = (0.75, −3), x_ref = (−1, −4): max(1.75, 1)/4 = 0.4375.
    expect(forwardError(Float64Array.of(0.75, -3), Float64Array.of(-1, -4))).toBe(0.4375);
    expect(forwardError(Float64Array.of(3, 4), Float64Array.of(3, 4))).toBe(0);
  });

  it('scales instead of overflowing, and follows 0/0 := 0, x/0 := ∞, NaN := ∞', () => {
    // Hand: (1e308 − (−1e308))/1e308 = 2, although the difference overflows in double.
    expect(forwardError(Float64Array.of(1e308), Float64Array.of(-1e308))).toBe(2);
    expect(forwardError(Float64Array.of(0, 0), Float64Array.of(0, 0))).toBe(0);
    expect(forwardError(Float64Array.of(0, 1e-300), Float64Array.of(0, 0))).toBe(Infinity);
    expect(forwardError(Float64Array.of(1, NaN), Float64Array.of(1, 2))).toBe(Infinity);
    expect(forwardError(Float64Array.of(1, Infinity), Float64Array.of(1, 2))).toBe(Infinity);
    expect(forwardError(new Float64Array(0), new Float64Array(0))).toBe(0);
    expect(() => forwardError(Float64Array.of(1), Float64Array.of(1, 2))).toThrow(RangeError);
  });
});

describe('forwardErrorOverBound', () => {
  it('divides by κ·u', () => {
    // Hand: 1e-10 / (1e5·2^-53) = 1e-15·2^53.
    expect(forwardErrorOverBound(1e-10, 1e5)).toBeCloseTo(1e-10 / (1e5 * UNIT_ROUNDOFF), 12);
    expect(forwardErrorOverBound(UNIT_ROUNDOFF * 8, 8)).toBe(1);
    expect(forwardErrorOverBound(0, 1)).toBe(0);
  });

  it('handles an infinite condition and non-finite errors without NaN, and rejects bad κ', () => {
    expect(forwardErrorOverBound(0.5, Infinity)).toBe(0);
    expect(forwardErrorOverBound(Infinity, Infinity)).toBe(Infinity);
    expect(forwardErrorOverBound(Infinity, 10)).toBe(Infinity);
    expect(forwardErrorOverBound(NaN, 10)).toBe(Infinity);
    for (const bad of [0, -1, NaN]) expect(() => forwardErrorOverBound(1, bad)).toThrow(RangeError);
  });
});
