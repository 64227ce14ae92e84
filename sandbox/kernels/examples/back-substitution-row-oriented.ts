/**
 * Back substitution: solves Ux = b with U upper triangular, row by row.
 *
 * Layout: dense row-major; entry (i, j) of the n×n matrix U is u[i*n + j]; entries below the
 * diagonal are not read. `b` is a fresh copy, overwritten with x and returned.
 * Cost: n² flops. Method: x_i = (b_i − Σ_{j>i} u_ij x_j) / u_ii for i = n−1 down to 0, each sum
 * along a contiguous row of U (Golub & Van Loan, Matrix Computations, 4th ed., §3.1, from memory).
 * Throws when a diagonal entry of U is exactly zero.
 */
export function solve(u: Float64Array, b: Float64Array, n: number): Float64Array {
  for (let i = n - 1; i >= 0; i--) {
    const row = i * n;
    let s = b[i]!;
    for (let j = i + 1; j < n; j++) s -= u[row + j]! * b[j]!;
    const diagonal = u[row + i]!;
    if (diagonal === 0) throw new Error(`singular: u[${i}, ${i}] is zero`);
    b[i] = s / diagonal;
  }
  return b;
}
