/**
 * Cholesky factorisation A = LLᵀ of a symmetric positive definite matrix: a plain starting point.
 *
 * Layout: dense row-major; entry (i, j) of the n×n matrix A is a[i*n + j]; only the lower
 * triangle of A is read. Returns a new n×n L, lower triangular with a positive diagonal.
 * Cost: n³/3 flops. Method: row by row, l_ij = (a_ij − Σ_{k<j} l_ik l_jk) / l_jj and
 * l_ii = √(a_ii − Σ_{k<i} l_ik²) (Golub & Van Loan, Matrix Computations, 4th ed., §4.2,
 * from memory).
 * Throws when a value under the square root is not positive: A is not positive definite.
 */
export function factor(a: Float64Array, n: number): { l: Float64Array } {
  const l = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j <= i; j++) {
      let s = a[i * n + j]!;
      for (let k = 0; k < j; k++) s -= l[i * n + k]! * l[j * n + k]!;
      if (i === j) {
        if (!(s > 0)) throw new Error(`not positive definite: pivot ${s} at column ${i}`);
        l[i * n + i] = Math.sqrt(s);
      } else {
        l[i * n + j] = s / l[j * n + j]!;
      }
    }
  }
  return { l };
}
