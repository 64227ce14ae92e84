import { describe, expect, it } from 'vitest';
import {
  choleskyFactorRatio,
  ldltFactorRatio,
  luFactorRatio,
  luResidual,
  qrFactorRatio,
} from '@sandbox/metrics/factor-residual.ts';
import { UNIT_ROUNDOFF } from '@sandbox/numerics/unit-roundoff.ts';
import {
  type Rational,
  div,
  fromDouble,
  fromDoubles,
  matMulExact,
  mul,
  norm1Exact,
  rational,
  sub,
  sum,
  toNumber,
  UNIT_ROUNDOFF_EXACT,
} from '@tests/helpers/rational.ts';
import { packLu, permuteRows, matmul, transpose, unpackLu } from '@tests/helpers/dense-matrix.ts';
import { gepp, luNoPivot } from '@tests/helpers/factorizations.ts';
import { hadamard4, worstGrowthMatrix } from '@tests/helpers/test-matrices.ts';

/** ‖M − product‖₁ / (k·‖M‖₁·u) in exact rational arithmetic (the LAPACK dget01 formula). */
function exactRatio(
  m: ArrayLike<number>,
  product: Rational[],
  rows: number,
  cols: number,
  k: number,
) {
  const r = product.map((p, idx) => sub(fromDouble(m[idx]!), p));
  const normR = norm1Exact(r, rows, cols);
  const normM = norm1Exact(fromDoubles(m), rows, cols);
  return toNumber(div(normR, mul(mul(rational(BigInt(k)), normM), UNIT_ROUNDOFF_EXACT)));
}

// Invented integer factors: L unit lower, U upper, perm a 3-cycle.
const L3 = Float64Array.of(1, 0, 0, 2, 1, 0, -1, 3, 1);
const U3 = Float64Array.of(2, 1, -1, 0, 3, 2, 0, 0, 4);
const PERM3 = Int32Array.of(2, 0, 1);
/** A with PA = L3·U3: row perm[i] of A is row i of L3·U3 (integers, so exact in double). */
function matrixFromFactors(): Float64Array {
  const lu = matmul(L3, U3, 3, 3, 3);
  const a = new Float64Array(9);
  for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) a[PERM3[i]! * 3 + j] = lu[i * 3 + j]!;
  return a;
}

describe('luFactorRatio', () => {
  it('is 0 for exact integer factors, with and without a permutation', () => {
    // Exact by construction: PA = LU holds in integer arithmetic.
    const a = matrixFromFactors();
    expect(luFactorRatio(a, 3, packLu(L3, U3, 3), PERM3)).toBe(0);
    expect(luFactorRatio(matmul(L3, U3, 3, 3, 3), 3, packLu(L3, U3, 3))).toBe(0);
    // numerics-references §4.12 / §11 row 38: GEPP of [[1,1,1],[1,1,2],[1,2,2]] swaps rows 2, 3,
    // L = [[1,0,0],[1,1,0],[1,0,1]], U = [[1,1,1],[0,1,1],[0,0,1]] exactly.
    const b = Float64Array.of(1, 1, 1, 1, 1, 2, 1, 2, 2);
    const lu = packLu(
      Float64Array.of(1, 0, 0, 1, 1, 0, 1, 0, 1),
      Float64Array.of(1, 1, 1, 0, 1, 1, 0, 0, 1),
      3,
    );
    expect(luFactorRatio(b, 3, lu, Int32Array.of(0, 2, 1))).toBe(0);
  });

  it('matches the exact rational ratio for perturbed factors', () => {
    // Check value: ‖PA − LU‖₁/(n‖A‖₁u) (LAPACK dget01) computed with BigInt rationals.
    const a = matrixFromFactors();
    const l = Float64Array.from(L3);
    const u = Float64Array.from(U3);
    l[2 * 3 + 1] = 3 + 0.1; // a decimal perturbation: 0.1 is not dyadic
    u[1 * 3 + 2] = 2 - 2 ** -40;
    const got = luFactorRatio(a, 3, packLu(l, u, 3), PERM3);
    const want = exactRatio(
      permuteRows(a, PERM3, 3),
      matMulExact(fromDoubles(l), fromDoubles(u), 3, 3, 3),
      3,
      3,
      3,
    );
    expect(want).toBeGreaterThan(1);
    expect(Math.abs(got - want) / want).toBeLessThan(1e-13);
  });

  it('keeps the ratio of a matrix scaled by 2^±1000 (power-of-two scaling is exact)', () => {
    const a = matrixFromFactors();
    const l = Float64Array.from(L3);
    l[2 * 3 + 1] = 3.1;
    const base = luFactorRatio(a, 3, packLu(l, U3, 3), PERM3);
    for (const s of [2 ** 1000, 2 ** -1000]) {
      const as = a.map((v) => v * s);
      const us = U3.map((v) => v * s);
      expect(luFactorRatio(as, 3, packLu(L3, us, 3), PERM3)).toBe(0);
      expect(luFactorRatio(as, 3, packLu(l, us, 3), PERM3)).toBe(base);
    }
  });

  it('§1.5: exact factors of the worst-growth matrix at n = 60 score ~0, a double residual ~1.5e13', () => {
    // numerics-references §1.5 / §11 row 12: for W_60, PLU − A = 0 exactly, yet LAPACK's GET01
    // evaluated in double reports about 1.5e13. The factors are the ones GEPP returns with the
    // first-maximum tie rule: P = I, L = lower triangle of W (−1 below the diagonal), U = I
    // except the last column (1, 2, 4, …, 2^59) (Burkardt, test_mat/gfpp.py).
    const n = 60;
    const a = worstGrowthMatrix(n);
    const l = new Float64Array(n * n);
    const u = new Float64Array(n * n);
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < i; j++) l[i * n + j] = -1;
      l[i * n + i] = 1;
      u[i * n + i] = 1;
      u[i * n + n - 1] = 2 ** i;
    }
    const lu = packLu(l, u, n);
    expect(gepp(a, n).lu).toEqual(lu); // the test's own GEPP agrees: these are GEPP's factors
    expect(luFactorRatio(a, n, lu)).toBeLessThan(1);
    // The naive check: L·U in double (inner products in order k = 0, 1, …), minus A.
    const naive = matmul(l, u, n, n, n).map((v, k) => v - a[k]!);
    let normR = 0;
    let normA = 0;
    for (let j = 0; j < n; j++) {
      let sr = 0;
      let sa = 0;
      for (let i = 0; i < n; i++) {
        sr += Math.abs(naive[i * n + j]!);
        sa += Math.abs(a[i * n + j]!);
      }
      normR = Math.max(normR, sr);
      normA = Math.max(normA, sa);
    }
    const naiveRatio = normR / (n * normA * UNIT_ROUNDOFF);
    // ≈ 1.5e13 (numerics-references §1.5): the check's own rounding, not the kernel's error.
    expect(naiveRatio / 1.5e13).toBeGreaterThan(0.9);
    expect(naiveRatio / 1.5e13).toBeLessThan(1.1);
  });

  it('[[1e-20, 1], [1, 1]]: no pivoting gives 2^51, partial pivoting ~0', () => {
    // numerics-references §4.12 / §11 row 39: GET01-style ratio 2^51 without pivoting.
    const a = Float64Array.of(1e-20, 1, 1, 1);
    expect(luFactorRatio(a, 2, luNoPivot(a, 2).lu)).toBe(2 ** 51);
    // With pivoting the table's 0 is the double-evaluated ratio; the exact residual is
    // (PA − LU)_22 = 1 − (1e-20·1 + 1) = −1e-20, so the accurate ratio is 1e-20/(2·2·u).
    const { lu, perm } = gepp(a, 2);
    const { l, u } = unpackLu(lu, 2);
    const want = exactRatio(
      permuteRows(a, perm, 2),
      matMulExact(fromDoubles(l), fromDoubles(u), 2, 2, 2),
      2,
      2,
      2,
    );
    expect(want).toBeCloseTo(1e-20 / (4 * UNIT_ROUNDOFF), 20);
    expect(Math.abs(luFactorRatio(a, 2, lu, perm) - want) / want).toBeLessThan(1e-13);
    expect(luFactorRatio(a, 2, lu, perm)).toBeLessThan(1e-4);
  });

  it('handles n = 0 and A = 0 as LAPACK dget01 does', () => {
    // dget01: quick exit RESID = 0 for N = 0; ‖A‖₁ = 0 gives 1/EPS when the residual is nonzero.
    expect(luFactorRatio(new Float64Array(0), 0, new Float64Array(0))).toBe(0);
    expect(luFactorRatio(new Float64Array(4), 2, new Float64Array(4))).toBe(0);
    expect(luFactorRatio(new Float64Array(4), 2, Float64Array.of(1, 0, 0, 0))).toBe(2 ** 53);
  });

  it('reports NaN, Infinity and overflowing factors as Infinity, never NaN', () => {
    const a = matrixFromFactors();
    for (const bad of [NaN, Infinity, -Infinity, 1e308]) {
      const lu = packLu(L3, U3, 3);
      lu[4] = bad;
      const lu2 = packLu(L3, U3, 3);
      lu2[3] = bad; // an entry of L
      for (const f of [lu, lu2]) {
        const r = luFactorRatio(a, 3, f, PERM3);
        expect(Number.isNaN(r)).toBe(false);
        expect(r).toBeGreaterThan(1e100);
      }
    }
  });

  it('fills the residual matrix with PA − LU scaled by the reported power of two', () => {
    const a = matrixFromFactors();
    const u = Float64Array.from(U3);
    u[0] = 2.5; // (LU)_00 grows by 0.5, so (PA − LU)_00 = −0.5 and (PA − LU)_i0 = −0.5·l_i0
    const res = luResidual(a, 3, packLu(L3, u, 3), PERM3);
    expect(Array.from(res.r, (v) => v / res.scale)).toEqual([-0.5, 0, 0, -1, 0, 0, 0.5, 0, 0]);
  });

  it('rejects malformed arguments with RangeError', () => {
    const a = matrixFromFactors();
    expect(() => luFactorRatio(a, 3, new Float64Array(8))).toThrow(RangeError);
    expect(() => luFactorRatio(a, 3, packLu(L3, U3, 3), Int32Array.of(0, 0, 1))).toThrow(/perm/);
    expect(() => luFactorRatio(a, -1, a)).toThrow(RangeError);
  });
});

describe('choleskyFactorRatio', () => {
  it('is 0 for the exact factors of minij and Pascal matrices', () => {
    // numerics-references §11 row 21: minij(n) = L·Lᵀ with L all-ones lower triangular.
    const n = 6;
    const minij = Float64Array.from(
      { length: n * n },
      (_, k) => Math.min(Math.floor(k / n), k % n) + 1,
    );
    const ones = Float64Array.from({ length: n * n }, (_, k) =>
      k % n <= Math.floor(k / n) ? 1 : 0,
    );
    expect(choleskyFactorRatio(minij, n, ones)).toBe(0);
    // §11 row 19: the Cholesky factor of Pascal P_n is the binomials C(i, j) (0-based), exact
    // for n ≤ 29; P_n = L·Lᵀ, here built in integers.
    const m = 12;
    const binom = new Float64Array(m * m);
    for (let i = 0; i < m; i++)
      for (let j = 0; j <= i; j++)
        binom[i * m + j] =
          j === 0 || j === i ? 1 : binom[(i - 1) * m + j - 1]! + binom[(i - 1) * m + j]!;
    const pascal = matmul(binom, transpose(binom, m, m), m, m, m);
    expect(choleskyFactorRatio(pascal, m, binom)).toBe(0);
  });

  it('matches the exact rational ratio for a perturbed factor, reading only the lower triangle', () => {
    // Check value: ‖A − LLᵀ‖₁/(n‖A‖₁u) (LAPACK dpot01) with BigInt rationals on the full matrix.
    const l = Float64Array.of(2, 0, 0, 1, 3, 0, -1, 2, 1);
    const a = matmul(l, transpose(l, 3, 3), 3, 3, 3);
    const lp = Float64Array.from(l);
    lp[1 * 3 + 0] = 1 + 1e-9;
    const want = exactRatio(
      a,
      matMulExact(fromDoubles(lp), fromDoubles(transpose(lp, 3, 3)), 3, 3, 3),
      3,
      3,
      3,
    );
    lp[0 * 3 + 2] = 99; // above the diagonal: ignored by the contract
    const aUpperJunk = Float64Array.from(a);
    aUpperJunk[0 * 3 + 1] = -7; // dpot01 reads only the stored (lower) triangle of A
    const got = choleskyFactorRatio(aUpperJunk, 3, lp);
    expect(Math.abs(got - want) / want).toBeLessThan(1e-13);
  });
});

describe('ldltFactorRatio', () => {
  it('is 0 for exact factors and matches the exact ratio when D is perturbed', () => {
    // Invented: L unit lower, D integer; A = L·D·Lᵀ formed exactly in integers.
    const l = Float64Array.of(1, 0, 0, 2, 1, 0, -1, 0.5, 1);
    const d = Float64Array.of(4, -2, 3);
    const ld = l.map((v, k) => v * d[k % 3]!);
    const a = matmul(ld, transpose(l, 3, 3), 3, 3, 3);
    expect(ldltFactorRatio(a, 3, l, d)).toBe(0);
    const dp = Float64Array.of(4, -2 + 1e-7, 3);
    // (L·D·Lᵀ)_ij = Σ_k l_ik·d_k·l_jk in exact rationals.
    const product: Rational[] = [];
    for (let i = 0; i < 3; i++)
      for (let j = 0; j < 3; j++) {
        const terms = [0, 1, 2].map((k) =>
          mul(mul(fromDouble(l[i * 3 + k]!), fromDouble(dp[k]!)), fromDouble(l[j * 3 + k]!)),
        );
        product.push(sum(terms));
      }
    const want = exactRatio(a, product, 3, 3, 3);
    const got = ldltFactorRatio(a, 3, l, dp);
    expect(Math.abs(got - want) / want).toBeLessThan(1e-13);
  });
});

describe('qrFactorRatio', () => {
  const H = hadamard4();

  it('is 0 for exact thin and square factors', () => {
    const r = Float64Array.of(2, 4, -6, 8, 0, 2, 4, -2, 0, 0, 6, 2, 0, 0, 0, 4);
    expect(qrFactorRatio(matmul(H, r, 4, 4, 4), 4, 4, H, r)).toBe(0);
    const q2 = Float64Array.from({ length: 8 }, (_, k) => H[Math.floor(k / 2) * 4 + (k % 2)]!);
    const r2 = Float64Array.of(2, 6, 0, 4);
    expect(qrFactorRatio(matmul(q2, r2, 4, 2, 2), 4, 2, q2, r2)).toBe(0);
  });

  it('matches the exact ratio ‖A − QR‖₁/(m‖A‖₁u) for a perturbed Q', () => {
    const r = Float64Array.of(2, 4, -6, 8, 0, 2, 4, -2, 0, 0, 6, 2, 0, 0, 0, 4);
    const a = matmul(H, r, 4, 4, 4);
    const q = Float64Array.from(H);
    q[5] = 0.5 + 3e-12;
    const want = exactRatio(a, matMulExact(fromDoubles(q), fromDoubles(r), 4, 4, 4), 4, 4, 4);
    const rJunk = Float64Array.from(r);
    rJunk[4] = 123; // below the diagonal of R: ignored
    const got = qrFactorRatio(a, 4, 4, q, rJunk);
    expect(Math.abs(got - want) / want).toBeLessThan(1e-13);
    expect(() => qrFactorRatio(a, 2, 4, q, r)).toThrow(RangeError);
  });
});
