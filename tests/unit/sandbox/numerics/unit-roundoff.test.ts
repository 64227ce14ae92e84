import { describe, expect, it } from 'vitest';
import { UNIT_ROUNDOFF, gamma } from '@sandbox/numerics/unit-roundoff.ts';

describe('unit roundoff', () => {
  it('is 2^-53, not Number.EPSILON', () => {
    // numerics-references §11 row 1 (LAPACK INSTALL/dlamch.f): DLAMCH('E') = 2^-53 =
    // 1.1102230246251565e-16 and DLAMCH('P') = 2^-52 = Number.EPSILON.
    expect(UNIT_ROUNDOFF).toBe(2 ** -53);
    expect(UNIT_ROUNDOFF).toBe(1.1102230246251565e-16);
    expect(Number.EPSILON).toBe(2 ** -52);
    expect(UNIT_ROUNDOFF).toBe(Number.EPSILON / 2);
  });

  it('is the largest relative rounding error at 1: 1 + u rounds to 1, 1 + 2u does not', () => {
    // Round to nearest, ties to even (IEEE 754; Higham, ASNA 2nd ed., §2.1, from memory).
    expect(1 + UNIT_ROUNDOFF).toBe(1);
    expect(1 + 2 * UNIT_ROUNDOFF).toBeGreaterThan(1);
  });

  it('gamma(k) = k·u/(1 − k·u), Infinity once k·u ≥ 1', () => {
    // Higham, ASNA 2nd ed., §3.1 (from memory).
    expect(gamma(0)).toBe(0);
    const ku = 10 * 2 ** -53;
    expect(gamma(10)).toBe(ku / (1 - ku));
    expect(gamma(2 ** 53)).toBe(Infinity);
    expect(gamma(2 ** 52)).toBe(1); // (1/2)/(1 − 1/2)
  });
});
