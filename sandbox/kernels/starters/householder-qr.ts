/**
 * Householder QR factorisation A = QR with thin Q: a plain starting point for a kernel.
 *
 * Layout: dense row-major; entry (i, j) of the m×n matrix A (m ≥ n) is a[i*n + j]. `a` is a
 * fresh copy, overwritten during the factorisation. Returns Q (m×n, orthonormal columns) and
 * R (n×n, upper triangular), both row-major.
 * Cost: 2mn² − 2n³/3 flops for R, about as much again to form Q. Method: for each column k a
 * reflector H_k = I − τ v vᵀ with v_k = 1 maps A(k:m, k) to β e_1, β = −sign(α)‖x‖ (the
 * convention of LAPACK's DLARFG); Q = H_0 H_1 ⋯ H_{n−1} applied to the first n columns of I
 * (Golub & Van Loan, Matrix Computations, 4th ed., §5.1–5.2, from memory). The column norm is
 * scaled by its largest entry so that it cannot overflow.
 */
export function factor(
  a: Float64Array,
  m: number,
  n: number,
): { q: Float64Array; r: Float64Array } {
  const v = new Float64Array(m * n);
  const tau = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    let scale = 0;
    for (let i = k; i < m; i++) scale = Math.max(scale, Math.abs(a[i * n + k]!));
    if (scale === 0) continue;
    let sum = 0;
    for (let i = k; i < m; i++) sum += (a[i * n + k]! / scale) ** 2;
    const alpha = a[k * n + k]!;
    const beta = (alpha >= 0 ? -scale : scale) * Math.sqrt(sum);
    v[k * n + k] = 1;
    for (let i = k + 1; i < m; i++) v[i * n + k] = a[i * n + k]! / (alpha - beta);
    tau[k] = (beta - alpha) / beta;
    applyReflector(a, v, tau[k]!, k, m, n, k);
  }
  const q = new Float64Array(m * n);
  for (let i = 0; i < n; i++) q[i * n + i] = 1;
  for (let k = n - 1; k >= 0; k--) applyReflector(q, v, tau[k]!, k, m, n, k);
  const r = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    for (let j = i; j < n; j++) r[i * n + j] = a[i * n + j]!;
  }
  return { q, r };
}

/** Applies H_k = I − τ v vᵀ (v in column k of `v`, rows k..m−1) to columns from..n−1 of `c`. */
function applyReflector(
  c: Float64Array,
  v: Float64Array,
  tau: number,
  k: number,
  m: number,
  n: number,
  from: number,
): void {
  if (tau === 0) return;
  for (let j = from; j < n; j++) {
    let s = 0;
    for (let i = k; i < m; i++) s += v[i * n + k]! * c[i * n + j]!;
    s *= tau;
    for (let i = k; i < m; i++) c[i * n + j] = c[i * n + j]! - s * v[i * n + k]!;
  }
}
