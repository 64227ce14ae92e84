import { describe, expect, it } from 'vitest';
import {
  choleskyComponentwiseBoundRatio,
  luComponentwiseBoundRatio,
} from '@sandbox/metrics/componentwise-bound.ts';
import { luResidual } from '@sandbox/metrics/factor-residual.ts';
import {
  type Rational,
  abs,
  div,
  fromDouble,
  max,
  mul,
  rational,
  sub,
  sum,
  toNumber,
  UNIT_ROUNDOFF_EXACT,
  ZERO,
} from '@tests/helpers/rational.ts';
import { matmul, transpose } from '@tests/helpers/dense-matrix.ts';
import { cholesky, gepp, luNoPivot } from '@tests/helpers/factorizations.ts';
import { randomMatrix, randomSpd } from '@tests/helpers/test-matrices.ts';

/** γ_n = nu/(1 − nu) exactly (Higham, ASNA 2nd ed., §3.1, from memory). */
function gammaExact(n: number): Rational {
  const nu = mul(rational(BigInt(n)), UNIT_ROUNDOFF_EXACT);
  return div(nu, sub(rational(1n), nu));
}

/**
 * max_ij |PA − LU|_ij / (γ_n (|L||U|)_ij) with 0/0 := 0, in exact rationals (the Thm 9.3
 * ratio of numerics-references §2.4), for packed lu and perm.
 */
function exactLuBoundRatio(
  a: ArrayLike<number>,
  n: number,
  lu: ArrayLike<number>,
  perm?: ArrayLike<number>,
) {
  const lAt = (i: number, k: number) =>
    k < i ? fromDouble(lu[i * n + k]!) : k === i ? rational(1n) : ZERO;
  const uAt = (k: number, j: number) => (k <= j ? fromDouble(lu[k * n + j]!) : ZERO);
  const g = gammaExact(n);
  let worst = ZERO;
  for (let i = 0; i < n; i++)
    for (let j = 0; j < n; j++) {
      const ks = Array.from({ length: n }, (_, k) => k);
      const prod = sum(ks.map((k) => mul(lAt(i, k), uAt(k, j))));
      const absProd = sum(ks.map((k) => mul(abs(lAt(i, k)), abs(uAt(k, j)))));
      const r = abs(sub(fromDouble(a[(perm ? perm[i]! : i) * n + j]!), prod));
      if (r.num === 0n) continue;
      if (absProd.num === 0n) return Infinity;
      worst = max(worst, div(r, mul(g, absProd)));
    }
  return toNumber(worst);
}

describe('luComponentwiseBoundRatio', () => {
  it('is 0 for exact factors', () => {
    // numerics-references §11 row 38: exact GEPP factors of [[1,1,1],[1,1,2],[1,2,2]].
    const a = Float64Array.of(1, 1, 1, 1, 1, 2, 1, 2, 2);
    const lu = Float64Array.of(1, 1, 1, 1, 1, 1, 1, 0, 1);
    expect(luComponentwiseBoundRatio(a, 3, lu, Int32Array.of(0, 2, 1))).toBe(0);
  });

  it('is at most 1 for GEPP in double on random matrices (Higham Thm 9.3)', () => {
    // numerics-references §11 row 5: ≤ 1 with no fudge; observed 0.01–0.08 for LAPACK's GEPP.
    for (const [n, seed] of [
      [5, 1],
      [20, 2],
      [60, 3],
    ] as const) {
      const a = randomMatrix(n, n, seed);
      const { lu, perm } = gepp(a, n);
      const ratio = luComponentwiseBoundRatio(a, n, lu, perm);
      expect(ratio).toBeGreaterThan(0);
      expect(ratio).toBeLessThanOrEqual(1);
    }
  });

  it('matches the exact rational ratio, and shares a precomputed residual', () => {
    // Without pivoting [[1e-20, 1], [1, 1]] has a huge normwise ratio (2^51) yet stays within
    // Thm 9.3's componentwise bound, which holds for any computed LU, pivoted or not.
    const a = Float64Array.of(1e-20, 1, 1, 1);
    const { lu } = luNoPivot(a, 2);
    const want = exactLuBoundRatio(a, 2, lu);
    expect(want).toBeLessThanOrEqual(1);
    const got = luComponentwiseBoundRatio(a, 2, lu, undefined, luResidual(a, 2, lu));
    expect(Math.abs(got - want) / want).toBeLessThan(1e-12);
    // A damaged factor: u_12 off by 1e-6 breaks the bound by orders of magnitude.
    const b = randomMatrix(4, 4, 7);
    const f = gepp(b, 4);
    f.lu[1 * 4 + 2] = f.lu[1 * 4 + 2]! + 1e-6;
    const bad = luComponentwiseBoundRatio(b, 4, f.lu, f.perm);
    expect(bad).toBeGreaterThan(1e3);
    expect(Math.abs(bad - exactLuBoundRatio(b, 4, f.lu, f.perm)) / bad).toBeLessThan(1e-12);
  });

  it('gives Infinity for a nonzero residual where |L||U| is 0, and for NaN factors', () => {
    // A = [[1, 1], [0, 1]] with factors L = U = I: r_12 = 1 over (|L||U|)_12 = 0.
    expect(
      luComponentwiseBoundRatio(Float64Array.of(1, 1, 0, 1), 2, Float64Array.of(1, 0, 0, 1)),
    ).toBe(Infinity);
    expect(
      luComponentwiseBoundRatio(Float64Array.of(1, 1, 0, 1), 2, Float64Array.of(1, NaN, 0, 1)),
    ).toBe(Infinity);
    expect(luComponentwiseBoundRatio(new Float64Array(0), 0, new Float64Array(0))).toBe(0);
  });
});

describe('choleskyComponentwiseBoundRatio', () => {
  it('is 0 for exact factors and at most 1 for Cholesky in double (Higham Thm 10.3)', () => {
    // numerics-references §11 row 21: minij(4) = L·Lᵀ with L all-ones lower.
    const ones = Float64Array.of(1, 0, 0, 0, 1, 1, 0, 0, 1, 1, 1, 0, 1, 1, 1, 1);
    expect(
      choleskyComponentwiseBoundRatio(matmul(ones, transpose(ones, 4, 4), 4, 4, 4), 4, ones),
    ).toBe(0);
    // §11 row 6: ≤ 1 with γ_{n+1}|L||Lᵀ| (observed 0.02–0.09).
    for (const [n, seed] of [
      [10, 11],
      [40, 12],
    ] as const) {
      const a = randomSpd(n, seed);
      const ratio = choleskyComponentwiseBoundRatio(a, n, cholesky(a, n).l);
      expect(ratio).toBeGreaterThan(0);
      expect(ratio).toBeLessThanOrEqual(1);
    }
  });

  it('matches the exact ratio for a perturbed factor', () => {
    const l = Float64Array.of(2, 0, 1, 3);
    const a = Float64Array.of(4, 2, 2, 10);
    const lp = Float64Array.of(2, 0, 1, 3 + 2 ** -45);
    // Only entry (2,2) changes: r_22 = 10 − (1 + (3 + δ)²), (|L||Lᵀ|)_22 = 1 + (3 + δ)².
    const l22 = fromDouble(lp[3]!);
    const sq = mul(l22, l22);
    const r = abs(sub(rational(10n), sum([rational(1n), sq])));
    const want = toNumber(div(r, mul(gammaExact(3), sum([rational(1n), sq]))));
    const got = choleskyComponentwiseBoundRatio(a, 2, lp);
    expect(Math.abs(got - want) / want).toBeLessThan(1e-12);
    expect(choleskyComponentwiseBoundRatio(a, 2, l)).toBe(0);
  });
});
