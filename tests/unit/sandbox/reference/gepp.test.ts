import { describe, expect, it } from 'vitest';
import { gamma, UNIT_ROUNDOFF } from '@sandbox/numerics/unit-roundoff.ts';
import { maxAbs, norm1 } from '@sandbox/numerics/norms.ts';
import { luFactorPartialPivoting, luSolve, luSolveTransposed } from '@sandbox/reference/gepp.ts';
import { permuteRows, unpackLu } from '@tests/helpers/dense-matrix.ts';
import {
  abs,
  div,
  fromDoubles,
  matMulExact,
  sub,
  toNumber,
  type Rational,
} from '@tests/helpers/rational.ts';
import { mulberry32 } from '@tests/helpers/seeded-random.ts';
import { worstGrowthMatrix } from '@tests/helpers/test-matrices.ts';

function factorOk(a: ArrayLike<number>, n: number) {
  const f = luFactorPartialPivoting(a, n);
  if (!f.ok) throw new Error(`unexpected zero pivot in column ${f.column}`);
  return f;
}

/** Exact PA − LU as rationals. */
function exactResidual(a: ArrayLike<number>, lu: Float64Array, perm: Int32Array, n: number) {
  const { l, u } = unpackLu(lu, n);
  const product = matMulExact(fromDoubles(l), fromDoubles(u), n, n, n);
  const pa = fromDoubles(permuteRows(a, perm, n));
  return pa.map((v, k) => sub(v, product[k]!));
}

const growth = (a: Float64Array, lu: Float64Array, n: number) =>
  maxAbs(unpackLu(lu, n).u) / maxAbs(a);

describe('luFactorPartialPivoting', () => {
  it('reproduces factors built by hand exactly, and PA = LU exactly', () => {
    // Invented: L = [[1,0,0],[1/2,1,0],[−1/4,1/2,1]], U = [[4,−2,8],[0,6,2],[0,0,−3]] and
    // perm = (2, 0, 1); A is the matrix with row perm[i] = row i of LU. Every multiplier is
    // dyadic and at most 1 in magnitude, so GEPP must return exactly these factors.
    const a = [2, 5, 6, -1, 3.5, -4, 4, -2, 8];
    const f = factorOk(a, 3);
    expect(Array.from(f.perm)).toEqual([2, 0, 1]);
    expect(Array.from(f.lu)).toEqual([4, -2, 8, 0.5, 6, 2, -0.25, 0.5, -3]);
    expect(exactResidual(a, f.lu, f.perm, 3).every((r) => r.num === 0n)).toBe(true);
  });

  it('meets |PA − LU| ≤ γ_n|L||U| exactly on random integer matrices', () => {
    // Higham, ASNA 2nd ed., Thm 9.3 (from memory); numerics-references §11 row 5. The residual
    // is evaluated exactly with rationals, so the bound needs no fudge factor.
    const rand = mulberry32(17);
    for (const n of [3, 5, 8, 12]) {
      const a = Float64Array.from({ length: n * n }, () => Math.floor(rand() * 19) - 9);
      const f = factorOk(a, n);
      const r = exactResidual(a, f.lu, f.perm, n);
      const { l, u } = unpackLu(f.lu, n);
      const absLU = matMulExact(
        fromDoubles(l.map(Math.abs)),
        fromDoubles(u.map(Math.abs)),
        n,
        n,
        n,
      );
      let worst = 0;
      for (let k = 0; k < n * n; k++) {
        if (r[k]!.num === 0n) continue;
        worst = Math.max(worst, toNumber(div(abs(r[k]!), absLU[k]!)) / gamma(n));
      }
      expect(worst).toBeLessThanOrEqual(1);
    }
  });

  it('picks the first maximum among equal |pivots| (LAPACK IDAMAX rule)', () => {
    expect(Array.from(factorOk([1, 2, -1, 3], 2).perm)).toEqual([0, 1]);
    expect(Array.from(factorOk([-1, 3, 1, 2], 2).perm)).toEqual([0, 1]);
    expect(Array.from(factorOk([1, 2, -3, 1], 2).perm)).toEqual([1, 0]);
    // Three candidates of magnitude 2 below a smaller one: the first of them (row 1) wins.
    const a = [0.5, 1, 0, 0, 2, 0, 1, 0, -2, 0, 0, 1, 2, 1, 1, 1];
    expect(factorOk(a, 4).perm[0]).toBe(1);
  });

  it('worst-growth matrix W_n: growth 2^(n−1) with first-max ties, no row swaps', () => {
    // numerics-references §11 row 7: 2^(n−1), e.g. 512 (n = 10), 524288 (n = 20);
    // Higham & Higham, SIMAX 10 (1989); Wilkinson's bound for partial pivoting.
    for (const n of [2, 3, 5, 10, 20]) {
      const a = worstGrowthMatrix(n, 1);
      const f = factorOk(a, n);
      expect(growth(a, f.lu, n)).toBe(2 ** (n - 1));
      expect(Array.from(f.perm)).toEqual(Array.from({ length: n }, (_, i) => i));
    }
  });

  it('the −0.5 variant grows as 1.5^(n−1) under any tie rule', () => {
    // numerics-references §11 row 9: 38.443359375 (n = 10), 127834.03948858939 (n = 30).
    const a10 = worstGrowthMatrix(10, 0.5);
    expect(growth(a10, factorOk(a10, 10).lu, 10)).toBe(38.443359375);
    const a30 = worstGrowthMatrix(30, 0.5);
    expect(growth(a30, factorOk(a30, 30).lu, 30)).toBe(127834.03948858939);
  });

  it('[[1,2],[2,4]] (must reject) has an exactly zero second pivot', () => {
    // numerics-references §11 row 35: U₂₂ = 4·0.5 − 2 = 0 exactly; LAPACK INFO = 2.
    expect(luFactorPartialPivoting([1, 2, 2, 4], 2)).toEqual({
      ok: false,
      reason: 'singular',
      column: 1,
    });
  });

  it('[[1,5,7],[2,10,−3],[5,25,1]] gives an exact zero without a fused multiply-add', () => {
    // numerics-references §11 row 37: 5 − fl(0.2)·25 = 0 in JS (OpenBLAS issue #610).
    expect(luFactorPartialPivoting([1, 5, 7, 2, 10, -3, 5, 25, 1], 3)).toEqual({
      ok: false,
      reason: 'singular',
      column: 1,
    });
  });

  it('[[1,2,3],[4,5,6],[7,8,9]] is nearly singular, not rejected: tiny last pivot', () => {
    // numerics-references §11 row 36: U₃₃ ≈ 2^-53 (order-dependent); test |U₃₃| ≤ 10u‖A‖.
    const a = [1, 2, 3, 4, 5, 6, 7, 8, 9];
    const f = factorOk(a, 3);
    const u33 = Math.abs(f.lu[8]!);
    expect(u33).toBeGreaterThan(0);
    expect(u33).toBeLessThanOrEqual(10 * UNIT_ROUNDOFF * norm1(a, 3, 3));
  });

  it('[[1,1,1],[1,1,2],[1,2,2]]: GEPP swaps rows 2 and 3 and returns exact factors', () => {
    // numerics-references §11 row 38: L = [[1,0,0],[1,1,0],[1,0,1]], U = [[1,1,1],[0,1,1],[0,0,1]].
    const f = factorOk([1, 1, 1, 1, 1, 2, 1, 2, 2], 3);
    expect(Array.from(f.perm)).toEqual([0, 2, 1]);
    expect(Array.from(f.lu)).toEqual([1, 1, 1, 1, 1, 1, 1, 0, 1]);
  });

  it('[[1e-20,1],[1,1]]: pivoted factors exact, double-evaluated GET01 residual 0', () => {
    // numerics-references §11 row 39: GEPP ratio 0 (no pivoting would give 2^51).
    const a = [1e-20, 1, 1, 1];
    const f = factorOk(a, 2);
    expect(Array.from(f.perm)).toEqual([1, 0]);
    expect(Array.from(f.lu)).toEqual([1, 1, 1e-20, 1]);
    // LU formed in double equals PA; exactly, PA − LU has the single entry −1e-20 at (2,2),
    // far below n·‖A‖₁·u.
    expect(1e-20 * 1 + 1 * 1).toBe(1);
    const r = exactResidual(a, f.lu, f.perm, 2).map((v: Rational) => toNumber(v));
    expect(r).toEqual([0, 0, 0, -1e-20]);
  });

  it('does not mutate its input; n = 0 and n = 1', () => {
    const a = Float64Array.from([1, 2, 3, 4]);
    luFactorPartialPivoting(a, 2);
    expect(Array.from(a)).toEqual([1, 2, 3, 4]);
    const f0 = luFactorPartialPivoting([], 0);
    expect(f0.ok && f0.lu.length === 0 && f0.perm.length === 0).toBe(true);
    expect(luFactorPartialPivoting([0], 1)).toEqual({ ok: false, reason: 'singular', column: 0 });
    const f1 = factorOk([5], 1);
    expect(Array.from(f1.lu)).toEqual([5]);
  });

  it('rejects bad arguments with a RangeError naming them', () => {
    expect(() => luFactorPartialPivoting([1, 2, 3], 2)).toThrow(/a must hold/);
    expect(() => luFactorPartialPivoting([], -1)).toThrow(/n must be/);
  });
});

describe('luSolve and luSolveTransposed', () => {
  const a = [2, 5, 6, -1, 3.5, -4, 4, -2, 8]; // the hand-built matrix above
  const f = factorOk(a, 3);

  it('solve A x = b and Aᵀ y = c exactly on the hand-built matrix', () => {
    // x = (1, 2, 3): A x = (2 + 10 + 18, −1 + 7 − 12, 4 − 4 + 24) = (30, −6, 24).
    expect(Array.from(luSolve(f.lu, f.perm, [30, -6, 24], 3))).toEqual([1, 2, 3]);
    // y = (1, −1, 2): Aᵀ y = (2 + 1 + 8, 5 − 3.5 − 4, 6 + 4 + 16) = (11, −2.5, 26).
    expect(Array.from(luSolveTransposed(f.lu, f.perm, [11, -2.5, 26], 3))).toEqual([1, -1, 2]);
  });

  it('do not mutate b and reject bad arguments', () => {
    const b = Float64Array.from([30, -6, 24]);
    luSolve(f.lu, f.perm, b, 3);
    expect(Array.from(b)).toEqual([30, -6, 24]);
    expect(() => luSolve(f.lu, f.perm, [1, 2], 3)).toThrow(/b must have length/);
    expect(() => luSolve(f.lu, Int32Array.from([0, 1, 3]), [1, 2, 3], 3)).toThrow(/perm\[2\]/);
    expect(() => luSolveTransposed(f.lu, Int32Array.from([0, 1]), [1, 2, 3], 3)).toThrow(
      /perm must have length/,
    );
    expect(() => luSolveTransposed(f.lu.subarray(0, 4), f.perm, [1, 2, 3], 3)).toThrow(
      /lu must hold/,
    );
  });
});
