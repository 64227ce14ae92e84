import { describe, expect, it } from 'vitest';
import { checkPermutation } from '@sandbox/metrics/argument-checks.ts';
import {
  backSubstitutionBackwardErrorLimit,
  metricBounds,
  passesBound,
} from '@sandbox/metrics/metric-bounds.ts';
import { powerOfTwoScale } from '@sandbox/metrics/power-of-two-scale.ts';
import { ratioOrWorst, worstIfNaN } from '@sandbox/metrics/safe-ratio.ts';
import { maxAbsLower, symmetricNorm1Lower } from '@sandbox/metrics/symmetric-norm.ts';
import { gamma } from '@sandbox/numerics/unit-roundoff.ts';

describe('powerOfTwoScale', () => {
  it('returns 2^k with σ·x in [0.5, 1), including next to powers of two and subnormals', () => {
    for (const x of [
      1,
      0.5,
      3,
      2 ** 52,
      2 ** 52 - 1,
      2 ** 1000 * 1.5,
      1e-300,
      2 ** 1021 * 1.5,
      2 ** -1000,
    ]) {
      const s = powerOfTwoScale(x);
      expect(Math.log2(s)).toBe(Math.round(Math.log2(s)));
      expect(s * x).toBeGreaterThanOrEqual(0.5);
      expect(s * x).toBeLessThan(1);
    }
    // Clamped to 2^±1022 at the ends of the range.
    expect(powerOfTwoScale(Number.MAX_VALUE)).toBe(2 ** -1022);
    expect(powerOfTwoScale(Number.MIN_VALUE)).toBe(2 ** 1022);
    expect(powerOfTwoScale(2 ** -1000, 511)).toBe(2 ** 511);
    for (const x of [0, -1, NaN, Infinity]) expect(powerOfTwoScale(x)).toBe(1);
    expect(() => powerOfTwoScale(1, 2000)).toThrow(RangeError);
  });
});

describe('ratioOrWorst and worstIfNaN', () => {
  it('follow 0/0 := 0, x/0 := ∞ (Oettli–Prager convention, Higham ASNA §7.2) and NaN := ∞', () => {
    expect(ratioOrWorst(0, 0)).toBe(0);
    expect(ratioOrWorst(1, 0)).toBe(Infinity);
    expect(ratioOrWorst(3, 4)).toBe(0.75);
    expect(ratioOrWorst(Infinity, Infinity)).toBe(Infinity);
    expect(ratioOrWorst(NaN, 1)).toBe(Infinity);
    expect(ratioOrWorst(0, NaN)).toBe(Infinity);
    expect(worstIfNaN(NaN)).toBe(Infinity);
    expect(worstIfNaN(2)).toBe(2);
  });
});

describe('symmetric norms from the lower triangle', () => {
  it('equal the full-matrix 1-norm and max of a symmetric matrix (DLANSY semantics)', () => {
    // Hand: S = [[1, −2, 3], [−2, 5, 0], [3, 0, −7]]: column sums 6, 7, 10; max |s| = 7.
    // The upper triangle holds junk to show that it is never read.
    const s = Float64Array.of(1, 99, 99, -2, 5, 99, 3, 0, -7);
    expect(symmetricNorm1Lower(s, 3)).toBe(10);
    expect(maxAbsLower(s, 3)).toBe(7);
    expect(Number.isNaN(symmetricNorm1Lower(Float64Array.of(1, 0, NaN, 1), 2))).toBe(true);
  });
});

describe('metricBounds', () => {
  it('pass below LAPACK’s threshold 30 and at most 1 for the componentwise bound ratio', () => {
    // numerics-references §1.2 / §11 row 2: fail when ratio ≥ 30 (dtest.in, dchkge.f).
    expect(metricBounds.factorRatio?.limit).toBe(30);
    expect(passesBound('factorRatio', 29.999)).toBe(true);
    expect(passesBound('factorRatio', 30)).toBe(false);
    expect(passesBound('factorRatio', NaN)).toBe(false);
    // §2.4 / §11 rows 5, 6: ≤ 1 with no fudge (Higham Thm 9.3, 10.3, from memory).
    expect(passesBound('componentwiseBoundRatio', 1)).toBe(true);
    expect(passesBound('componentwiseBoundRatio', 1 + 2 ** -52)).toBe(false);
    expect(passesBound('growthFactor', 1e300)).toBeUndefined();
    expect(backSubstitutionBackwardErrorLimit(10)).toBe(gamma(10));
  });
});

describe('checkPermutation', () => {
  it('accepts permutations and names perm otherwise', () => {
    expect(() => checkPermutation(Int32Array.of(2, 0, 1), 3)).not.toThrow();
    for (const bad of [
      [0, 0, 1],
      [0, 1, 3],
      [0, 1],
      [0, -1, 2],
    ])
      expect(() => checkPermutation(bad, 3)).toThrow(/perm/);
  });
});
