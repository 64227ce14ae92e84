import { describe, expect, it } from 'vitest';
import { matVecAccurate } from '@sandbox/numerics/accurate-residual.ts';
import { UNIT_ROUNDOFF } from '@sandbox/numerics/unit-roundoff.ts';
import { luFactorPartialPivoting, luSolve } from '@sandbox/reference/gepp.ts';
import { TRUSTED_CONDITION_LIMIT, referenceSolve } from '@sandbox/reference/reference-solve.ts';
import {
  type Rational,
  ZERO,
  abs,
  compare,
  div,
  fromDouble,
  fromDoubles,
  solveExact,
  sub,
  toNumber,
} from '@tests/helpers/rational.ts';
import { hilbert, worstGrowthMatrix } from '@tests/helpers/test-matrices.ts';

const u = UNIT_ROUNDOFF;

/** The forward-error tolerance where the reference is trusted: 2u (observed up to about 1u). */
const TOLERANCE = 2 * u;

/** Pascal P_n, p_ij = C(i + j, i) with 0-based indices (numerics-references §4.2). */
function pascal(n: number): Float64Array {
  const a = new Float64Array(n * n);
  for (let i = 0; i < n; i++)
    for (let j = 0; j < n; j++)
      a[i * n + j] = i === 0 || j === 0 ? 1 : a[(i - 1) * n + j]! + a[i * n + j - 1]!;
  return a;
}

/** ‖x − x*‖∞ / ‖x*‖∞ against the exact solution of the stored system, evaluated exactly. */
function forwardError(a: ArrayLike<number>, n: number, b: ArrayLike<number>, x: Float64Array) {
  const exact = solveExact(fromDoubles(a), n, fromDoubles(b));
  if (exact === null) throw new Error('singular test matrix');
  let err: Rational = ZERO;
  let norm: Rational = ZERO;
  for (let i = 0; i < n; i++) {
    const e = abs(sub(fromDouble(x[i]!), exact[i]!));
    if (compare(e, err) > 0) err = e;
    if (compare(abs(exact[i]!), norm) > 0) norm = abs(exact[i]!);
  }
  return toNumber(div(err, norm));
}

/** b = A·1 computed accurately and rounded, as the engine builds right-hand sides. */
const rhsOnes = (a: Float64Array, n: number) =>
  matVecAccurate(a, n, n, new Float64Array(n).fill(1));

describe('referenceSolve against exact rational solutions', () => {
  it('the trust limit is 1/(16u) = 2^49', () => {
    expect(TRUSTED_CONDITION_LIMIT).toBe(2 ** 49);
  });

  it('Hilbert n = 4…10 (κ₁ up to 3.5e13): trusted, forward error ≤ 2u', () => {
    // κ₁(fl(H_n)) from numerics-references §4.1 stays below 2^49 ≈ 5.6e14 up to n = 10.
    for (let n = 4; n <= 10; n++) {
      const a = hilbert(n);
      const b = rhsOnes(a, n);
      const r = referenceSolve(a, n, b);
      expect(r.trusted).toBe(true);
      expect(r.reason).toBeUndefined();
      expect(r.method).toBe('gepp+refinement');
      expect(r.steps).toBeGreaterThanOrEqual(1);
      expect(forwardError(a, n, b, r.x)).toBeLessThanOrEqual(TOLERANCE);
    }
  });

  it('Hilbert n = 11, 12 (κ₁ 1.2e15, 4.0e16): not trusted, yet still accurate', () => {
    // numerics-references §4.1: κ₁(H₁₁) = 1.2337e15, κ₁(fl(H₁₂)) = 4.0402e16, both ≥ 2^49.
    for (const n of [11, 12]) {
      const a = hilbert(n);
      const b = rhsOnes(a, n);
      const r = referenceSolve(a, n, b);
      expect(r.trusted).toBe(false);
      expect(r.conditionEstimate).toBeGreaterThanOrEqual(TRUSTED_CONDITION_LIMIT);
      expect(r.reason).toMatch(/condition estimate/);
      expect(forwardError(a, n, b, r.x)).toBeLessThanOrEqual(TOLERANCE);
    }
  });

  it('Pascal n = 4…10: trusted, forward error ≤ 2u', () => {
    for (let n = 4; n <= 10; n++) {
      const a = pascal(n);
      const b = Float64Array.from({ length: n }, (_, i) => (i % 2 === 0 ? 1 : -2) * (i + 1));
      const r = referenceSolve(a, n, b);
      expect(r.trusted).toBe(true);
      expect(forwardError(a, n, b, r.x)).toBeLessThanOrEqual(TOLERANCE);
    }
  });

  it('random integer matrices n = 3…12: trusted, forward error ≤ 2u', () => {
    let seed = 2024;
    const rand = () => (seed = (seed * 48271) % 2147483647);
    for (let n = 3; n <= 12; n++) {
      const a = Float64Array.from({ length: n * n }, () => (rand() % 201) - 100);
      const b = Float64Array.from({ length: n }, () => (rand() % 21) - 10);
      const r = referenceSolve(a, n, b);
      expect(r.trusted).toBe(r.conditionEstimate < TRUSTED_CONDITION_LIMIT);
      expect(r.trusted).toBe(true);
      expect(forwardError(a, n, b, r.x)).toBeLessThanOrEqual(TOLERANCE);
    }
  });

  it('[[1,2,3],[4,5,6],[7,8,9+ε]]: trusted for ε = 2^-30, not for ε = 2^-48', () => {
    // det = −3ε (worked by hand), so κ grows like 1/ε: about 1e11 and 6e16.
    const near = (eps: number) => [1, 2, 3, 4, 5, 6, 7, 8, 9 + eps];
    const b = [1, -1, 2];
    const ok = referenceSolve(near(2 ** -30), 3, b);
    expect(ok.trusted).toBe(true);
    expect(forwardError(near(2 ** -30), 3, b, ok.x)).toBeLessThanOrEqual(TOLERANCE);
    const bad = referenceSolve(near(2 ** -48), 3, b);
    expect(bad.trusted).toBe(false);
    expect(bad.conditionEstimate).toBeGreaterThanOrEqual(TRUSTED_CONDITION_LIMIT);
  });

  it('[[1,2,3],[4,5,6],[7,8,9]] (rank 2) is not trusted', () => {
    // numerics-references §11 row 36: GEPP's last pivot is about 2^-53, not 0; the exact system
    // has no solution, so the reference must say it cannot be trusted.
    expect(solveExact(fromDoubles([1, 2, 3, 4, 5, 6, 7, 8, 9]), 3, fromDoubles([1, 1, 2]))).toBe(
      null,
    );
    const r = referenceSolve([1, 2, 3, 4, 5, 6, 7, 8, 9], 3, [1, 1, 2]);
    expect(r.trusted).toBe(false);
    expect(r.conditionEstimate).toBeGreaterThanOrEqual(1 / (10 * 3 * u));
  });

  it('[[1,2],[2,4]] (must reject) is singular: NaN solution, not trusted', () => {
    // numerics-references §11 row 35.
    const r = referenceSolve([1, 2, 2, 4], 2, [1, 2]);
    expect(r.trusted).toBe(false);
    expect(r.method).toBe('double-double-lu');
    expect(r.conditionEstimate).toBe(Infinity);
    expect(r.reason).toMatch(/singular/);
    expect(Array.from(r.x).every(Number.isNaN)).toBe(true);
  });

  it('falls back to double-double on a rounding zero pivot: [[3,1],[1,fl(1/3)]]', () => {
    // Nonsingular (det = −2^-54, see lu-double-double.test.ts) but GEPP in double finds U₂₂ = 0.
    const a = [3, 1, 1, 1 / 3];
    const b = [1, 2];
    const r = referenceSolve(a, 2, b);
    expect(r.method).toBe('double-double-lu');
    expect(r.trusted).toBe(false);
    expect(r.reason).toMatch(/zero pivot/);
    expect(forwardError(a, 2, b, r.x)).toBeLessThanOrEqual(TOLERANCE);
  });

  it('W₆₀: GEPP alone is 100 % wrong, the reference is exact', () => {
    // numerics-references §11 row 11: with b = W·1, GEPP's solve has ∞-norm error 1.0 for
    // n ≥ 55; κ₁(W_n) = n (row 10), so the reference must be trusted and accurate.
    const n = 60;
    const a = worstGrowthMatrix(n);
    const b = rhsOnes(a, n);
    const f = luFactorPartialPivoting(a, n);
    if (!f.ok) throw new Error('unexpected zero pivot');
    const plain = luSolve(f.lu, f.perm, b, n);
    expect(Math.max(...plain.map((v) => Math.abs(v - 1)))).toBe(1);
    const r = referenceSolve(a, n, b);
    expect(r.trusted).toBe(true);
    expect(Array.from(r.x)).toEqual(new Array(n).fill(1));
    expect(r.conditionEstimate).toBeCloseTo(60, 6);
  });
});

describe('referenceSolve edge cases', () => {
  it('n = 0 and n = 1', () => {
    expect(referenceSolve([], 0, [])).toEqual({
      x: new Float64Array(0),
      trusted: true,
      steps: 0,
      method: 'gepp+refinement',
      conditionEstimate: 1,
    });
    const r = referenceSolve([4], 1, [2]);
    expect(Array.from(r.x)).toEqual([0.5]);
    expect(r.trusted).toBe(true);
  });

  it('b = 0 gives x = 0', () => {
    const r = referenceSolve([2, 1, 1, 3], 2, [0, 0]);
    expect(Array.from(r.x)).toEqual([0, 0]);
    expect(r.trusted).toBe(true);
  });

  it('does not mutate its inputs', () => {
    const a = Float64Array.from([2, 1, 1, 3]);
    const b = Float64Array.from([3, 5]);
    referenceSolve(a, 2, b);
    expect(Array.from(a)).toEqual([2, 1, 1, 3]);
    expect(Array.from(b)).toEqual([3, 5]);
  });

  it('rejects bad arguments with a RangeError naming them', () => {
    expect(() => referenceSolve([1, 2, 3], 2, [1, 2])).toThrow(/a must hold/);
    expect(() => referenceSolve([1, 0, 0, 1], 2, [1])).toThrow(/b must have length/);
    expect(() => referenceSolve([1, NaN, 0, 1], 2, [1, 1])).toThrow(/a must be finite/);
    expect(() => referenceSolve([1, 0, 0, 1], 2, [Infinity, 1])).toThrow(/b must be finite/);
    expect(() => referenceSolve([], -1, [])).toThrow(/n must be/);
  });
});
