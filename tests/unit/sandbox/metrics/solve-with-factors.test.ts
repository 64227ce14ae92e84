import { describe, expect, it } from 'vitest';
import {
  solveWithCholesky,
  solveWithFactors,
  solveWithLdlt,
  solveWithLu,
} from '@sandbox/metrics/solve-with-factors.ts';

// numerics-references §4.12 / §11 row 38: A = [[1,1,1],[1,1,2],[1,2,2]]; GEPP swaps rows 2, 3
// and gives L = [[1,0,0],[1,1,0],[1,0,1]], U = [[1,1,1],[0,1,1],[0,0,1]] exactly.
const LU = Float64Array.of(1, 1, 1, 1, 1, 1, 1, 0, 1);
const PERM = Int32Array.of(0, 2, 1);
// b = A·(1, 2, 3) = (6, 9, 11), integers, so every substitution step is exact.
const B = Float64Array.of(6, 9, 11);

describe('solveWithLu', () => {
  it('applies perm to b (row i of PA = row perm[i] of A) before the two triangular solves', () => {
    expect(Array.from(solveWithLu(LU, PERM, B, 3))).toEqual([1, 2, 3]);
    // Without the permutation the same factors solve LUx = b, i.e. a different system.
    expect(Array.from(solveWithLu(LU, undefined, B, 3))).not.toEqual([1, 2, 3]);
    expect(() => solveWithLu(LU, Int32Array.of(0, 1, 1), B, 3)).toThrow(RangeError);
    expect(() => solveWithLu(LU, PERM, Float64Array.of(1, 2), 3)).toThrow(RangeError);
  });
});

describe('solveWithCholesky and solveWithLdlt', () => {
  it('solve minij(3) = LLᵀ (L all-ones lower) exactly', () => {
    // numerics-references §11 row 21; b = minij(3)·(1, −1, 2) = (2, 3, 5).
    const l = Float64Array.of(1, 0, 0, 1, 1, 0, 1, 1, 1);
    expect(Array.from(solveWithCholesky(l, Float64Array.of(2, 3, 5), 3))).toEqual([1, -1, 2]);
    // The same matrix as LDLᵀ with D = I; entries on and above the diagonal of l are ignored.
    const junk = Float64Array.of(9, 9, 9, 1, 9, 9, 1, 1, 9);
    expect(
      Array.from(solveWithLdlt(junk, Float64Array.of(1, 1, 1), Float64Array.of(2, 3, 5), 3)),
    ).toEqual([1, -1, 2]);
  });

  it('divides by D: A = L·diag(2, −4)·Lᵀ with l_21 = 0.5', () => {
    // Hand: A = [[2, 1], [1, −3.5]], x = (1, 2): b = (4, −6).
    const l = Float64Array.of(1, 0, 0.5, 1);
    expect(Array.from(solveWithLdlt(l, Float64Array.of(2, -4), Float64Array.of(4, -6), 2))).toEqual(
      [1, 2],
    );
  });
});

describe('solveWithFactors', () => {
  it('dispatches per routine', () => {
    expect(
      Array.from(solveWithFactors('lu-partial-pivoting', { lu: LU, perm: PERM }, B, 3)!),
    ).toEqual([1, 2, 3]);
    // LU without pivoting: the contract is A = LU, so a returned perm is ignored.
    expect(solveWithFactors('lu-no-pivoting', { lu: LU, perm: PERM }, B, 3)).toEqual(
      solveWithLu(LU, undefined, B, 3),
    );
    expect(solveWithFactors('householder-qr', { q: LU, r: LU }, B, 3)).toBeUndefined();
    const x = Float64Array.of(4, 5, 6);
    const got = solveWithFactors('back-substitution', { x }, B, 3)!;
    expect(Array.from(got)).toEqual([4, 5, 6]);
    expect(got).not.toBe(x);
    expect(() => solveWithFactors('cholesky', { x }, B, 3)).toThrow(TypeError);
  });
});
