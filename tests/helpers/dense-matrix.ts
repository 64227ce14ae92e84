/**
 * Plain double operations on dense row-major matrices for the tests: entry (i, j) of an m×n
 * matrix at a[i*n + j]. Products sum in the order k = 0, 1, … (the textbook inner product,
 * Golub & Van Loan, 4th ed., §1.1, from memory), so tests can reason about their rounding.
 * Inputs are never mutated; each function returns a new array.
 */

/** C = A·B with A m×k and B k×n (a matrix-vector product when n = 1). */
export function matmul(
  a: ArrayLike<number>,
  b: ArrayLike<number>,
  m: number,
  k: number,
  n: number,
): Float64Array {
  const c = new Float64Array(m * n);
  for (let i = 0; i < m; i++)
    for (let j = 0; j < n; j++) {
      let s = 0;
      for (let p = 0; p < k; p++) s += a[i * k + p]! * b[p * n + j]!;
      c[i * n + j] = s;
    }
  return c;
}

/** Aᵀ (n×m) of an m×n A. */
export function transpose(a: ArrayLike<number>, m: number, n: number): Float64Array {
  const t = new Float64Array(n * m);
  for (let i = 0; i < m; i++) for (let j = 0; j < n; j++) t[j * m + i] = a[i * n + j]!;
  return t;
}

/** The lower triangle of the n×n a, zeros above; with unit = true the diagonal is 1. */
export function lowerTriangle(a: ArrayLike<number>, n: number, unit = false): Float64Array {
  const l = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < i; j++) l[i * n + j] = a[i * n + j]!;
    l[i * n + i] = unit ? 1 : a[i * n + i]!;
  }
  return l;
}

/** The upper triangle of the n×n a (diagonal included), zeros below. */
export function upperTriangle(a: ArrayLike<number>, n: number): Float64Array {
  const u = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let j = i; j < n; j++) u[i * n + j] = a[i * n + j]!;
  return u;
}

/** Dense unit-lower L and upper U from a packed LU. */
export function unpackLu(lu: ArrayLike<number>, n: number): { l: Float64Array; u: Float64Array } {
  return { l: lowerTriangle(lu, n, true), u: upperTriangle(lu, n) };
}

/** Packs the strict lower part of L and the upper triangle of U into one array. */
export function packLu(l: ArrayLike<number>, u: ArrayLike<number>, n: number): Float64Array {
  return Float64Array.from({ length: n * n }, (_, k) =>
    k % n < Math.floor(k / n) ? l[k]! : u[k]!,
  );
}

/** PA with row i of PA = row perm[i] of the n×n A. */
export function permuteRows(
  a: ArrayLike<number>,
  perm: ArrayLike<number>,
  n: number,
): Float64Array {
  const pa = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) pa[i * n + j] = a[perm[i]! * n + j]!;
  return pa;
}

/** The diagonal of U from a packed LU. */
export function pivotsOf(lu: ArrayLike<number>, n: number): number[] {
  return Array.from({ length: n }, (_, k) => lu[k * n + k]!);
}

/** max|u_ij| / max|a_ij|, the U-based growth factor (Higham, ASNA 2nd ed., §9.3). */
export function growthFactor(lu: ArrayLike<number>, a: ArrayLike<number>, n: number): number {
  let maxU = 0;
  let maxA = 0;
  for (let i = 0; i < n; i++)
    for (let j = i; j < n; j++) maxU = Math.max(maxU, Math.abs(lu[i * n + j]!));
  for (let k = 0; k < n * n; k++) maxA = Math.max(maxA, Math.abs(a[k]!));
  return maxU / maxA;
}
