/**
 * LU factorisation with partial pivoting, PA = LU.
 * (Example kernel: what the engine must conclude about it is in example-catalog.ts.)
 *
 * Layout: dense row-major; entry (i, j) of the n×n matrix A is a[i*n + j]. `a` is a fresh copy,
 * overwritten with the packed factors.
 * Cost: 2n³/3 flops. Method: right-looking Gaussian elimination with partial pivoting (Golub &
 * Van Loan, Matrix Computations, 4th ed., §3.4, from memory). The rows are exchanged in `a`, but
 * the exchanges are never recorded: perm stays the identity.
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
    const pivotRow = k * n;
    if (p !== k) {
      for (let j = 0; j < n; j++) {
        const t = a[pivotRow + j]!;
        a[pivotRow + j] = a[p * n + j]!;
        a[p * n + j] = t;
      }
    }
    const pivot = a[pivotRow + k]!;
    for (let i = k + 1; i < n; i++) {
      const row = i * n;
      const l = a[row + k]! / pivot;
      a[row + k] = l;
      for (let j = k + 1; j < n; j++) a[row + j] = a[row + j]! - l * a[pivotRow + j]!;
    }
  }
  return { lu: a, perm };
}
