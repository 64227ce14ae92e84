/**
 * LDLᵀ factorisation of a symmetric matrix without pivoting: a plain starting point.
 *
 * Layout: dense row-major; entry (i, j) of the n×n matrix A is a[i*n + j]; only the lower
 * triangle of A is read. Returns a new n×n unit lower L (strict lower part; the diagonal is
 * implied) and the n pivots d, with A = L·diag(d)·Lᵀ.
 * Cost: n³/3 flops. Method: column by column, d_j = a_jj − Σ_{k<j} l_jk² d_k and
 * l_ij = (a_ij − Σ_{k<j} l_ik d_k l_jk) / d_j (Golub & Van Loan, Matrix Computations, 4th ed.,
 * §4.1, from memory).
 * Throws when a pivot d_j is exactly zero.
 */
export function factor(a: Float64Array, n: number): { l: Float64Array; d: Float64Array } {
  const l = new Float64Array(n * n);
  const d = new Float64Array(n);
  for (let j = 0; j < n; j++) {
    let dj = a[j * n + j]!;
    for (let k = 0; k < j; k++) dj -= l[j * n + k]! * l[j * n + k]! * d[k]!;
    if (dj === 0) throw new Error(`zero pivot d[${j}]: LDLᵀ without pivoting breaks down`);
    d[j] = dj;
    for (let i = j + 1; i < n; i++) {
      let s = a[i * n + j]!;
      for (let k = 0; k < j; k++) s -= l[i * n + k]! * d[k]! * l[j * n + k]!;
      l[i * n + j] = s / dj;
    }
  }
  return { l, d };
}
