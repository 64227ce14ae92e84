/**
 * The upper triangular U a back-substitution kernel is handed for a square matrix A: A itself
 * when it is upper triangular, else the U of Gaussian elimination with partial pivoting. Like
 * LAPACK's DGETRF, elimination continues past an exactly zero pivot (that column is skipped),
 * so a singular A gives a U with an exact zero on its diagonal, which the kernel must reject.
 * Layout: row-major n×n (a[i*n + j]); a is not mutated. Cost 2n³/3 flops.
 * Method: Golub & Van Loan, Matrix Computations, 4th ed., §3.4.3 (from memory).
 */
export function upperFactorForBackSubstitution(
  a: ArrayLike<number>,
  n: number,
  upperTriangular: boolean,
): Float64Array {
  const w = Float64Array.from(a);
  if (!upperTriangular) {
    for (let k = 0; k < n; k++) {
      let p = k;
      let max = Math.abs(w[k * n + k]!);
      for (let i = k + 1; i < n; i++) {
        const v = Math.abs(w[i * n + k]!);
        if (v > max) {
          max = v;
          p = i;
        }
      }
      if (max === 0) continue;
      if (p !== k) {
        for (let j = 0; j < n; j++) {
          const t = w[k * n + j]!;
          w[k * n + j] = w[p * n + j]!;
          w[p * n + j] = t;
        }
      }
      const pivot = w[k * n + k]!;
      for (let i = k + 1; i < n; i++) {
        const l = w[i * n + k]! / pivot;
        if (l === 0) continue;
        for (let j = k + 1; j < n; j++) w[i * n + j]! -= l * w[k * n + j]!;
      }
    }
  }
  for (let i = 1; i < n; i++) for (let j = 0; j < i; j++) w[i * n + j] = 0;
  return w;
}
