/**
 * Householder QR factorisation A = QR with thin Q, written for speed in row-major storage.
 *
 * Layout: dense row-major; entry (i, j) of the m×n matrix A (m ≥ n) is a[i*n + j]. `a` is a
 * fresh copy: R is built in its upper triangle and the Householder vectors below the diagonal
 * (v_k = 1 implied), as LAPACK's DGEQRF stores them. Returns Q (m×n) and R (n×n), row-major.
 * Cost: 2mn² − 2n³/3 flops for R and about as much again for Q. Method: reflector
 * H_k = I − τ v vᵀ with β = −sign(α)‖x‖ and τ = (β − α)/β (LAPACK DLARFG's convention; Golub &
 * Van Loan, Matrix Computations, 4th ed., §5.1–5.2, from memory), the norm scaled by the
 * column's largest entry against overflow. Each reflector is applied as w = vᵀC then
 * C ← C − τ v wᵀ, both passes along contiguous rows; Q = H_0 ⋯ H_{n−1} applied to [I; 0],
 * last reflector first.
 */
export function factor(
  a: Float64Array,
  m: number,
  n: number,
): { q: Float64Array; r: Float64Array } {
  const tau = new Float64Array(n);
  const w = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    let scale = 0;
    for (let i = k; i < m; i++) scale = Math.max(scale, Math.abs(a[i * n + k]!));
    if (scale === 0) continue;
    let sum = 0;
    for (let i = k; i < m; i++) {
      const x = a[i * n + k]! / scale;
      sum += x * x;
    }
    const alpha = a[k * n + k]!;
    const beta = (alpha >= 0 ? -scale : scale) * Math.sqrt(sum);
    const inverse = 1 / (alpha - beta);
    for (let i = k + 1; i < m; i++) a[i * n + k] = a[i * n + k]! * inverse;
    tau[k] = (beta - alpha) / beta;
    a[k * n + k] = beta;
    reflect(a, a, tau[k]!, k, m, n, k + 1, w);
  }
  const r = new Float64Array(n * n);
  for (let i = 0; i < n; i++) r.set(a.subarray(i * n + i, i * n + n), i * n + i);
  const q = new Float64Array(m * n);
  for (let i = 0; i < n; i++) q[i * n + i] = 1;
  for (let k = n - 1; k >= 0; k--) reflect(q, a, tau[k]!, k, m, n, k, w);
  return { q, r };
}

/**
 * Applies H_k = I − τ v vᵀ to columns from..n−1 of the m×n row-major `c`, with v_k = 1 and
 * v_i (i > k) stored in column k of `v`.
 */
function reflect(
  c: Float64Array,
  v: Float64Array,
  tau: number,
  k: number,
  m: number,
  n: number,
  from: number,
  w: Float64Array,
): void {
  if (tau === 0 || from >= n) return;
  const top = k * n;
  for (let j = from; j < n; j++) w[j] = c[top + j]!;
  for (let i = k + 1; i < m; i++) {
    const vi = v[i * n + k]!;
    if (vi === 0) continue;
    const row = i * n;
    for (let j = from; j < n; j++) w[j] = w[j]! + vi * c[row + j]!;
  }
  for (let j = from; j < n; j++) {
    w[j] = w[j]! * tau;
    c[top + j] = c[top + j]! - w[j]!;
  }
  for (let i = k + 1; i < m; i++) {
    const vi = v[i * n + k]!;
    if (vi === 0) continue;
    const row = i * n;
    for (let j = from; j < n; j++) c[row + j] = c[row + j]! - vi * w[j]!;
  }
}
