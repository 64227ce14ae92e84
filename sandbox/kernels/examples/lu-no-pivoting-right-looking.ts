/**
 * LU factorisation without pivoting, A = LU, written for speed in row-major storage.
 *
 * Layout: dense row-major; entry (i, j) of the n×n matrix A is a[i*n + j]. `a` is a fresh copy,
 * overwritten with the packed factors (strict lower part L with implied unit diagonal, upper
 * part with the diagonal U).
 * Cost: 2n³/3 flops. Method: right-looking Gaussian elimination without row exchanges (Golub &
 * Van Loan, Matrix Computations, 4th ed., §3.2, from memory), inner loop along contiguous rows,
 * rows with a zero multiplier skipped.
 * Throws when a pivot is exactly zero.
 */
export function factor(a: Float64Array, n: number): { lu: Float64Array } {
  for (let k = 0; k < n; k++) {
    const pivotRow = k * n;
    const pivot = a[pivotRow + k]!;
    if (pivot === 0) throw new Error(`zero pivot at step ${k}: LU without pivoting breaks down`);
    for (let i = k + 1; i < n; i++) {
      const row = i * n;
      const l = a[row + k]! / pivot;
      a[row + k] = l;
      if (l === 0) continue;
      for (let j = k + 1; j < n; j++) a[row + j] = a[row + j]! - l * a[pivotRow + j]!;
    }
  }
  return { lu: a };
}
