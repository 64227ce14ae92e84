import { contractPreamble } from '@shared/contracts/contract-preamble.ts';

/** Contract text for `ldlt`: `factor(a, n)` → `{ l, d }` with A = LDLᵀ, no pivoting. */
export const ldltContract = `${contractPreamble}
/** The factors of A = LDLᵀ. */
export interface LdltFactors {
  /**
   * n×n, row-major: the strict lower part holds L (unit lower triangular; its unit diagonal is
   * implied). Entries on and above the diagonal are ignored.
   */
  l: Float64Array;
  /** Length n: the diagonal of D (entries may be negative: A need not be definite). */
  d: Float64Array;
}

/**
 * LDLᵀ factorisation of a symmetric matrix without pivoting: A = LDLᵀ.
 * @param a - the symmetric n×n matrix A, row-major: A(i, j) = a[i*n + j]; both triangles are
 *   supplied (a kernel may read either); a fresh copy the kernel may overwrite
 * @param n - the order of A (n ≥ 1)
 * @returns the unit lower factor l and the diagonal d
 * @throws Error when a pivot d[k] is exactly zero (a leading principal minor is singular)
 */
export declare function factor(a: Float64Array, n: number): LdltFactors;
`;
