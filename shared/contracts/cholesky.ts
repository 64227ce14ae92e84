import { contractPreamble } from '@shared/contracts/contract-preamble.ts';

/** Contract text for `cholesky`: `factor(a, n)` → `{ l }` with A = LLᵀ. */
export const choleskyContract = `${contractPreamble}
/** The Cholesky factor. */
export interface CholeskyFactor {
  /**
   * n×n, row-major: L lower triangular with a positive diagonal, A = LLᵀ. Only the lower part
   * with the diagonal is read; entries above the diagonal are ignored.
   */
  l: Float64Array;
}

/**
 * Cholesky factorisation of a symmetric positive definite matrix: A = LLᵀ.
 * @param a - the symmetric n×n matrix A, row-major: A(i, j) = a[i*n + j]; both triangles are
 *   supplied (a kernel may read either); a fresh copy the kernel may overwrite
 * @param n - the order of A (n ≥ 1)
 * @returns the factor l
 * @throws Error when A is found not to be positive definite (a diagonal value ≤ 0 during the
 *   factorisation); taking the square root of a negative or zero number is a silent failure
 */
export declare function factor(a: Float64Array, n: number): CholeskyFactor;
`;
