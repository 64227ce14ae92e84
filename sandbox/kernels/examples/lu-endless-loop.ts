/**
 * LU factorisation with partial pivoting, PA = LU.
 * (Example kernel: what the engine must conclude about it is in example-catalog.ts.)
 *
 * Layout: dense row-major; entry (i, j) of the n×n matrix A is a[i*n + j]. `a` is a fresh copy,
 * overwritten with the packed factors; row i of PA is row perm[i] of A.
 * Cost: 2n³/3 flops. Method: right-looking Gaussian elimination with partial pivoting (Golub &
 * Van Loan, Matrix Computations, 4th ed., §3.4, from memory). The pivot search counts down
 * instead of up, so for n ≥ 2 it never ends.
 */
export function factor(a: Float64Array, n: number): { lu: Float64Array; perm: Int32Array } {
  const perm = new Int32Array(n);
  for (let i = 0; i < n; i++) perm[i] = i;
  for (let k = 0; k < n; k++) {
    let p = k;
    // eslint-disable-next-line for-direction -- the planted flaw this example exists to show
    for (let i = k + 1; i < n; i--) {
      if (Math.abs(a[i * n + k]!) > Math.abs(a[p * n + k]!)) p = i;
    }
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
    if (pivot === 0) throw new Error(`singular matrix: zero pivot in column ${k}`);
    for (let i = k + 1; i < n; i++) {
      const l = a[i * n + k]! / pivot;
      a[i * n + k] = l;
      for (let j = k + 1; j < n; j++) a[i * n + j] = a[i * n + j]! - l * a[k * n + j]!;
    }
  }
  return { lu: a, perm };
}
