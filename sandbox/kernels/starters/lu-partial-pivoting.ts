/**
 * LU factorisation with partial pivoting, PA = LU: a plain starting point for a kernel.
 *
 * Layout: dense row-major; entry (i, j) of the n×n matrix A is a[i*n + j]. `a` is a fresh copy
 * and is overwritten with the packed factors: the strict lower part holds L (its unit diagonal
 * is not stored), the upper part with the diagonal holds U. Row i of PA is row perm[i] of A.
 * Cost: 2n³/3 flops. Method: Gaussian elimination with partial pivoting, exchanging whole rows
 * (Golub & Van Loan, Matrix Computations, 4th ed., §3.4, from memory); the pivot is the first
 * entry of largest magnitude, the tie rule of LAPACK's IDAMAX.
 * Throws when a pivot is exactly zero (A is singular).
 */
export function factor(a: Float64Array, n: number): { lu: Float64Array; perm: Int32Array } {
  const perm = new Int32Array(n);
  for (let i = 0; i < n; i++) perm[i] = i;
  for (let k = 0; k < n; k++) {
    let p = k;
    for (let i = k + 1; i < n; i++) {
      if (Math.abs(a[i * n + k]!) > Math.abs(a[p * n + k]!)) p = i;
    }
    if (a[p * n + k] === 0) throw new Error(`singular matrix: column ${k} has no nonzero pivot`);
    if (p !== k) {
      for (let j = 0; j < n; j++) {
        const t = a[k * n + j]!;
        a[k * n + j] = a[p * n + j]!;
        a[p * n + j] = t;
      }
      const t = perm[k]!;
      perm[k] = perm[p]!;
      perm[p] = t;
    }
    const pivot = a[k * n + k]!;
    for (let i = k + 1; i < n; i++) {
      const l = a[i * n + k]! / pivot;
      a[i * n + k] = l;
      for (let j = k + 1; j < n; j++) a[i * n + j] = a[i * n + j]! - l * a[k * n + j]!;
    }
  }
  return { lu: a, perm };
}
