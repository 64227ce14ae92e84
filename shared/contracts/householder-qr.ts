import { contractPreamble } from '@shared/contracts/contract-preamble.ts';

/** Contract text for `householder-qr`: `factor(a, m, n)` → thin `{ q, r }` with A = QR. */
export const householderQrContract = `${contractPreamble}
/** The thin QR factors. */
export interface QrFactors {
  /** m×n, row-major: Q(i, j) = q[i*n + j], with orthonormal columns. */
  q: Float64Array;
  /**
   * n×n, row-major: R(i, j) = r[i*n + j], upper triangular. Only the upper part with the
   * diagonal is read; entries below the diagonal are ignored.
   */
  r: Float64Array;
}

/**
 * Householder QR factorisation of a tall or square matrix: A = QR with thin Q.
 * @param a - the m×n matrix A, row-major: A(i, j) = a[i*n + j]; a fresh copy the kernel may overwrite
 * @param m - the number of rows (m ≥ n)
 * @param n - the number of columns (n ≥ 1)
 * @returns q (m×n) and r (n×n)
 * @throws nothing for rank-deficient A: the factorisation exists for every A
 */
export declare function factor(a: Float64Array, m: number, n: number): QrFactors;
`;
