/**
 * LU factorisation for the partial-pivoting routine, PA = LU.
 * (Example kernel: what the engine must conclude about it is in example-catalog.ts.)
 *
 * Layout: dense row-major; entry (i, j) of the n×n matrix A is a[i*n + j]. `a` is a fresh copy,
 * overwritten with the packed factors (strict lower part L, upper part with the diagonal U).
 * Cost: 2n³/3 flops. Method: right-looking Gaussian elimination (Golub & Van Loan, Matrix
 * Computations, 4th ed., §3.2, from memory). Skips the pivot search: "our matrices never need it".
 */
export function factor(a: Float64Array, n: number): { lu: Float64Array; perm: Int32Array } {
  const perm = new Int32Array(n);
  for (let i = 0; i < n; i++) perm[i] = i;
  for (let k = 0; k < n; k++) {
    const pivotRow = k * n;
    const pivot = a[pivotRow + k]!;
    if (pivot === 0) throw new Error(`zero pivot at step ${k}`);
    for (let i = k + 1; i < n; i++) {
      const row = i * n;
      const l = a[row + k]! / pivot;
      a[row + k] = l;
      for (let j = k + 1; j < n; j++) a[row + j] = a[row + j]! - l * a[pivotRow + j]!;
    }
  }
  return { lu: a, perm };
}
