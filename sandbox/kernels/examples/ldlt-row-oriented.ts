/**
 * LDLᵀ factorisation of a symmetric matrix without pivoting, computed in place row by row.
 *
 * Layout: dense row-major; entry (i, j) of the n×n matrix A is a[i*n + j]. `a` is a fresh copy;
 * its strict lower triangle is overwritten with the unit lower L (the contract ignores the rest).
 * The pivots go to d, with A = L·diag(d)·Lᵀ.
 * Cost: n³/3 flops. Method: for row i, with t_k = l_ik d_k kept as l_ik is found,
 * l_ij = (a_ij − Σ_{k<j} t_k l_jk) / d_j and d_i = a_ii − Σ_{k<i} t_k l_ik (Golub & Van Loan,
 * Matrix Computations, 4th ed., §4.1, from memory); every sum runs along contiguous rows.
 * Throws when a pivot d_i is exactly zero.
 */
export function factor(a: Float64Array, n: number): { l: Float64Array; d: Float64Array } {
  const d = new Float64Array(n);
  const t = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const rowI = i * n;
    for (let j = 0; j < i; j++) {
      const rowJ = j * n;
      let s = a[rowI + j]!;
      for (let k = 0; k < j; k++) s -= t[k]! * a[rowJ + k]!;
      t[j] = s;
      a[rowI + j] = s / d[j]!;
    }
    let di = a[rowI + i]!;
    for (let k = 0; k < i; k++) di -= t[k]! * a[rowI + k]!;
    if (di === 0) throw new Error(`zero pivot d[${i}]: LDLᵀ without pivoting breaks down`);
    d[i] = di;
  }
  return { l: a, d };
}
