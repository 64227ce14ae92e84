import { contractPreamble } from '@shared/contracts/contract-preamble.ts';

/** Contract text for `lu-no-pivoting`: `factor(a, n)` → `{ lu }` with A = LU, no row exchanges. */
export const luNoPivotingContract = `${contractPreamble}
/** Packed LU factors, computed without row exchanges. */
export interface LuFactorsUnpivoted {
  /**
   * n×n, row-major. The strict lower part holds L (unit lower triangular; its unit diagonal is
   * implied, not stored); the upper part with the diagonal holds U.
   */
  lu: Float64Array;
}

/**
 * LU factorisation without pivoting: A = LU, for matrices known to be safe without row exchanges
 * (for example diagonally dominant ones).
 * @param a - the n×n matrix A, row-major: A(i, j) = a[i*n + j]; a fresh copy the kernel may overwrite
 * @param n - the order of A (n ≥ 1)
 * @returns the packed factors lu
 * @throws Error when a pivot is exactly zero (a leading principal minor is singular)
 */
export declare function factor(a: Float64Array, n: number): LuFactorsUnpivoted;
`;
