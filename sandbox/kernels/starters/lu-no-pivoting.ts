/**
 * LU factorisation without pivoting, A = LU: a plain starting point for a kernel.
 *
 * Layout: dense row-major; entry (i, j) of the n×n matrix A is a[i*n + j]. `a` is a fresh copy
 * and is overwritten with the packed factors: the strict lower part holds L (its unit diagonal
 * is not stored), the upper part with the diagonal holds U.
 * Cost: 2n³/3 flops. Method: Gaussian elimination without row exchanges (Golub & Van Loan,
 * Matrix Computations, 4th ed., §3.2, from memory); safe for matrices such as diagonally
 * dominant ones, where no pivot can vanish.
 * Throws when a pivot is exactly zero (a leading principal minor is singular).
 */
export function factor(a: Float64Array, n: number): { lu: Float64Array } {
  for (let k = 0; k < n; k++) {
    const pivot = a[k * n + k]!;
    if (pivot === 0) throw new Error(`zero pivot at step ${k}: LU without pivoting breaks down`);
    for (let i = k + 1; i < n; i++) {
      const l = a[i * n + k]! / pivot;
      a[i * n + k] = l;
      for (let j = k + 1; j < n; j++) a[i * n + j] = a[i * n + j]! - l * a[k * n + j]!;
    }
  }
  return { lu: a };
}
