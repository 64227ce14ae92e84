/**
 * Cholesky factorisation A = LLᵀ, computed in place row by row.
 * (Example kernel: what the engine must conclude about it is in example-catalog.ts.)
 *
 * Layout: dense row-major; entry (i, j) of the n×n matrix A is a[i*n + j]. `a` is a fresh copy;
 * its lower triangle is overwritten with L.
 * Cost: n³/3 flops. Method: l_ij = (a_ij − Σ_{k<j} l_ik l_jk) / l_jj, l_ii = √(a_ii − Σ_{k<i} l_ik²)
 * (Golub & Van Loan, Matrix Computations, 4th ed., §4.2, from memory). The square root is taken
 * of |a_ii − Σ| "to absorb rounding that makes a pivot slightly negative": a matrix that is not
 * positive definite is never reported.
 */
export function factor(a: Float64Array, n: number): { l: Float64Array } {
  for (let i = 0; i < n; i++) {
    const rowI = i * n;
    for (let j = 0; j <= i; j++) {
      const rowJ = j * n;
      let s = a[rowI + j]!;
      for (let k = 0; k < j; k++) s -= a[rowI + k]! * a[rowJ + k]!;
      a[rowI + j] = j < i ? s / a[rowJ + j]! : Math.sqrt(Math.abs(s));
    }
  }
  return { l: a };
}
