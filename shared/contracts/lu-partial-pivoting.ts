import { contractPreamble } from '@shared/contracts/contract-preamble.ts';

/** Contract text for `lu-partial-pivoting`: `factor(a, n)` → `{ lu, perm }` with PA = LU. */
export const luPartialPivotingContract = `${contractPreamble}
/** Packed LU factors with the row permutation of partial pivoting. */
export interface LuFactors {
  /**
   * n×n, row-major. The strict lower part holds L (unit lower triangular; its unit diagonal is
   * implied, not stored); the upper part with the diagonal holds U.
   */
  lu: Float64Array;
  /** Length n: row i of PA is row perm[i] of A, so perm is a permutation of 0..n−1. */
  perm: Int32Array;
}

/**
 * LU factorisation with partial pivoting (row exchanges): PA = LU.
 * @param a - the n×n matrix A, row-major: A(i, j) = a[i*n + j]; a fresh copy the kernel may overwrite
 * @param n - the order of A (n ≥ 1)
 * @returns the packed factors lu and the permutation perm
 * @throws Error when a pivot is exactly zero (A is singular)
 */
export declare function factor(a: Float64Array, n: number): LuFactors;
`;
