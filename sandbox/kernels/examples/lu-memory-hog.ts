/**
 * LU factorisation with partial pivoting, PA = LU, on preallocated scratch space.
 * (Example kernel: what the engine must conclude about it is in example-catalog.ts.)
 *
 * Layout: dense row-major; entry (i, j) of the n×n matrix A is a[i*n + j]. Returns new packed
 * factors; row i of PA is row perm[i] of A.
 * Cost: 2n³/3 flops. Method: right-looking Gaussian elimination with partial pivoting (Golub &
 * Van Loan, Matrix Computations, 4th ed., §3.4, from memory) in a scratch matrix. The first
 * call allocates scratch matrices for every power-of-two order up to 4096 "so that later calls
 * never allocate": about 179 MB, more than the sandbox allows.
 */
const scratch: Float64Array[] = [];

function scratchFor(n: number): Float64Array {
  if (scratch.length === 0) {
    for (let size = 16; size <= 4096; size *= 2) scratch.push(new Float64Array(size * size));
  }
  const fit = scratch.find((s) => s.length >= n * n);
  return fit ? fit.subarray(0, n * n) : new Float64Array(n * n);
}

export function factor(a: Float64Array, n: number): { lu: Float64Array; perm: Int32Array } {
  const w = scratchFor(n);
  w.set(a);
  const perm = new Int32Array(n);
  for (let i = 0; i < n; i++) perm[i] = i;
  for (let k = 0; k < n; k++) {
    let p = k;
    for (let i = k + 1; i < n; i++) {
      if (Math.abs(w[i * n + k]!) > Math.abs(w[p * n + k]!)) p = i;
    }
    if (w[p * n + k] === 0) throw new Error(`singular matrix: column ${k} has no nonzero pivot`);
    if (p !== k) {
      for (let j = 0; j < n; j++) {
        const t = w[k * n + j]!;
        w[k * n + j] = w[p * n + j]!;
        w[p * n + j] = t;
      }
      const t = perm[k]!;
      perm[k] = perm[p]!;
      perm[p] = t;
    }
    const pivot = w[k * n + k]!;
    for (let i = k + 1; i < n; i++) {
      const l = w[i * n + k]! / pivot;
      w[i * n + k] = l;
      for (let j = k + 1; j < n; j++) w[i * n + j] = w[i * n + j]! - l * w[k * n + j]!;
    }
  }
  return { lu: w.slice(), perm };
}
