/**
 * LU factorisation with partial pivoting, PA = LU, written for speed in row-major storage.
 *
 * Layout: dense row-major; entry (i, j) of the n×n matrix A is a[i*n + j]. `a` is a fresh copy,
 * overwritten with the packed factors (strict lower part L with implied unit diagonal, upper
 * part with the diagonal U). Row i of PA is row perm[i] of A.
 * Cost: 2n³/3 flops. Method: right-looking Gaussian elimination with partial pivoting (Golub &
 * Van Loan, Matrix Computations, 4th ed., §3.4, from memory). Each step updates the trailing rows
 * with the pivot row, so the inner loop runs along contiguous memory; rows whose multiplier is
 * zero are skipped. Pivot: the first entry of largest magnitude (LAPACK IDAMAX's tie rule).
 * Throws when a pivot is exactly zero.
 */
export function factor(a: Float64Array, n: number): { lu: Float64Array; perm: Int32Array } {
  const perm = new Int32Array(n);
  for (let i = 0; i < n; i++) perm[i] = i;
  for (let k = 0; k < n; k++) {
    let p = k;
    let largest = Math.abs(a[k * n + k]!);
    for (let i = k + 1; i < n; i++) {
      const candidate = Math.abs(a[i * n + k]!);
      if (candidate > largest) {
        largest = candidate;
        p = i;
      }
    }
    if (largest === 0) throw new Error(`singular matrix: column ${k} has no nonzero pivot`);
    const pivotRow = k * n;
    if (p !== k) {
      const otherRow = p * n;
      for (let j = 0; j < n; j++) {
        const t = a[pivotRow + j]!;
        a[pivotRow + j] = a[otherRow + j]!;
        a[otherRow + j] = t;
      }
      const t = perm[k]!;
      perm[k] = perm[p]!;
      perm[p] = t;
    }
    const pivot = a[pivotRow + k]!;
    for (let i = k + 1; i < n; i++) {
      const row = i * n;
      const l = a[row + k]! / pivot;
      a[row + k] = l;
      if (l === 0) continue;
      for (let j = k + 1; j < n; j++) a[row + j] = a[row + j]! - l * a[pivotRow + j]!;
    }
  }
  return { lu: a, perm };
}
