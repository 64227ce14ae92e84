/**
 * Back substitution: solves Ux = b with U upper triangular. A plain starting point.
 *
 * Layout: dense row-major; entry (i, j) of the n×n matrix U is u[i*n + j]; entries below the
 * diagonal are not read. `b` is a fresh copy, overwritten with x and returned.
 * Cost: n² flops. Method: x_i = (b_i − Σ_{j>i} u_ij x_j) / u_ii for i = n−1 down to 0
 * (Golub & Van Loan, Matrix Computations, 4th ed., §3.1, from memory).
 * Throws when a diagonal entry of U is exactly zero.
 */
export function solve(u: Float64Array, b: Float64Array, n: number): Float64Array {
  const x = b;
  for (let i = n - 1; i >= 0; i--) {
    let s = x[i]!;
    for (let j = i + 1; j < n; j++) s -= u[i * n + j]! * x[j]!;
    const diagonal = u[i * n + i]!;
    if (diagonal === 0) throw new Error(`singular: u[${i}, ${i}] is zero`);
    x[i] = s / diagonal;
  }
  return x;
}
