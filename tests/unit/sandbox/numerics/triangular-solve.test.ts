import { describe, expect, it } from 'vitest';
import {
  solveLower,
  solveLowerTransposed,
  solveLowerUnit,
  solveLowerUnitTransposed,
  solveUpper,
} from '@sandbox/numerics/triangular-solve.ts';

// Hand-made 3×3 triangles with small integer entries and integer solutions, so every step of
// the substitutions is exact in double (Golub & Van Loan, 4th ed., §3.1, from memory).
// Entries outside the triangle a solve may read are NaN: reading one would poison the result.
const N = NaN;
const L = Float64Array.from([2, N, N, 1, 3, N, -1, 2, 4]); // lower with diagonal
const U = Float64Array.from([2, 1, -1, N, 3, 2, N, N, 4]); // upper with diagonal
const LUnit = Float64Array.from([N, N, N, 1, N, N, -1, 2, N]); // strict lower, unit diagonal

describe('triangular solves', () => {
  it('solveLower: L x = b', () => {
    // x = (1, 2, 3): b = (2·1, 1 + 6, −1 + 4 + 12) = (2, 7, 15).
    expect(Array.from(solveLower(L, [2, 7, 15], 3))).toEqual([1, 2, 3]);
  });

  it('solveUpper: U x = b', () => {
    // x = (1, 2, 3): b = (2 + 2 − 3, 6 + 6, 12) = (1, 12, 12).
    expect(Array.from(solveUpper(U, [1, 12, 12], 3))).toEqual([1, 2, 3]);
  });

  it('solveLowerUnit ignores the diagonal', () => {
    // x = (1, 2, 3): b = (1, 1 + 2, −1 + 4 + 3) = (1, 3, 6).
    expect(Array.from(solveLowerUnit(LUnit, [1, 3, 6], 3))).toEqual([1, 2, 3]);
  });

  it('solveLowerTransposed: Lᵀ x = b', () => {
    // Lᵀ = [[2, 1, −1], [0, 3, 2], [0, 0, 4]]; x = (1, 2, 3): b = (2 + 2 − 3, 6 + 6, 12).
    expect(Array.from(solveLowerTransposed(L, [1, 12, 12], 3))).toEqual([1, 2, 3]);
  });

  it('solveLowerUnitTransposed: Lᵀ x = b with unit diagonal', () => {
    // Lᵀ = [[1, 1, −1], [0, 1, 2], [0, 0, 1]]; x = (1, 2, 3): b = (1 + 2 − 3, 2 + 6, 3).
    expect(Array.from(solveLowerUnitTransposed(LUnit, [0, 8, 3], 3))).toEqual([1, 2, 3]);
  });

  it('does not mutate its inputs', () => {
    const b = Float64Array.from([2, 7, 15]);
    const t = Float64Array.from(L);
    solveLower(t, b, 3);
    expect(Array.from(b)).toEqual([2, 7, 15]);
    expect(t).toEqual(L);
  });

  it('handles n = 0 and n = 1', () => {
    expect(solveUpper(new Float64Array(0), new Float64Array(0), 0)).toHaveLength(0);
    expect(Array.from(solveLower([4], [2], 1))).toEqual([0.5]);
    expect(Array.from(solveLowerUnit([NaN], [2], 1))).toEqual([2]);
  });

  it('a zero diagonal entry gives non-finite values (no check, as documented)', () => {
    const x = solveUpper([1, 1, N, 0], [1, 1], 2);
    expect(Number.isFinite(x[1]!)).toBe(false);
  });

  it('rejects bad arguments with a RangeError naming them', () => {
    expect(() => solveLower(L, [1, 2, 3], -1)).toThrow(RangeError);
    expect(() => solveLower(L, [1, 2, 3], 1.5)).toThrow(/n must be/);
    expect(() => solveUpper(L.subarray(0, 8), [1, 2, 3], 3)).toThrow(/t must hold/);
    expect(() => solveLowerUnitTransposed(L, [1, 2], 3)).toThrow(/b must have length/);
  });
});
