import { contractPreamble } from '@shared/contracts/contract-preamble.ts';

/** Contract text for `back-substitution`: `solve(u, b, n)` → `x` with Ux = b. */
export const backSubstitutionContract = `${contractPreamble}
/**
 * Back substitution: solves Ux = b for x, with U upper triangular.
 * @param u - the n×n upper triangular matrix U, row-major: U(i, j) = u[i*n + j]; entries below
 *   the diagonal must not be read; a fresh copy the kernel may overwrite
 * @param b - the right-hand side, length n; a fresh copy the kernel may overwrite and return
 * @param n - the order of U (n ≥ 1)
 * @returns x, a Float64Array of length n
 * @throws Error when a diagonal entry of U is exactly zero (U is singular)
 */
export declare function solve(u: Float64Array, b: Float64Array, n: number): Float64Array;
`;
