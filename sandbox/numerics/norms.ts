/**
 * Matrix and vector norms on dense row-major storage: entry (i, j) of an m×n matrix is
 * a[i*n + j]. ‖A‖₁ is the largest column sum of |a_ij|, ‖A‖∞ the largest row sum
 * (Golub & Van Loan, Matrix Computations, 4th ed., §2.3.2).
 */

/** ‖A‖₁ = max_j Σ_i |a_ij|. Cost m·n. */
export function norm1(a: ArrayLike<number>, m: number, n: number): number {
  const sums = new Float64Array(n);
  for (let i = 0; i < m; i++) {
    const row = i * n;
    for (let j = 0; j < n; j++) sums[j]! += Math.abs(a[row + j]!);
  }
  let max = 0;
  for (let j = 0; j < n; j++) if (sums[j]! > max || Number.isNaN(sums[j]!)) max = sums[j]!;
  return max;
}

/** ‖A‖∞ = max_i Σ_j |a_ij|. Cost m·n. */
export function normInf(a: ArrayLike<number>, m: number, n: number): number {
  let max = 0;
  for (let i = 0; i < m; i++) {
    let s = 0;
    const row = i * n;
    for (let j = 0; j < n; j++) s += Math.abs(a[row + j]!);
    if (s > max || Number.isNaN(s)) max = s;
  }
  return max;
}

/** max_ij |a_ij|. */
export function maxAbs(a: ArrayLike<number>, length = a.length): number {
  let max = 0;
  for (let k = 0; k < length; k++) {
    const v = Math.abs(a[k]!);
    if (v > max || Number.isNaN(v)) max = v;
  }
  return max;
}

/** ‖x‖∞ of a vector. */
export function vectorNormInf(x: ArrayLike<number>): number {
  return maxAbs(x);
}

/** ‖x‖₁ of a vector. */
export function vectorNorm1(x: ArrayLike<number>): number {
  let s = 0;
  for (let k = 0; k < x.length; k++) s += Math.abs(x[k]!);
  return s;
}
