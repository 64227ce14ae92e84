/**
 * Cholesky factorisation A = LLᵀ, computed in place row by row.
 *
 * Layout: dense row-major; entry (i, j) of the n×n matrix A is a[i*n + j]. `a` is a fresh copy;
 * its lower triangle is read and overwritten with L, and the upper triangle is left as it was
 * (the contract ignores it).
 * Cost: n³/3 flops. Method: l_ij = (a_ij − Σ_{k<j} l_ik l_jk) / l_jj, l_ii = √(a_ii − Σ_{k<i} l_ik²)
 * (Golub & Van Loan, Matrix Computations, 4th ed., §4.2, from memory); both sums run along two
 * contiguous rows of L.
 * Throws when a value under the square root is not positive (A is not positive definite).
 */
export function factor(a: Float64Array, n: number): { l: Float64Array } {
  for (let i = 0; i < n; i++) {
    const rowI = i * n;
    for (let j = 0; j <= i; j++) {
      const rowJ = j * n;
      let s = a[rowI + j]!;
      for (let k = 0; k < j; k++) s -= a[rowI + k]! * a[rowJ + k]!;
      if (j < i) {
        a[rowI + j] = s / a[rowJ + j]!;
      } else {
        if (!(s > 0)) throw new Error(`not positive definite: pivot ${s} at column ${i}`);
        a[rowI + i] = Math.sqrt(s);
      }
    }
  }
  return { l: a };
}
