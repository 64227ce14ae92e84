/**
 * The engine's own Householder QR factorisation in double, for benchmarks and as a trusted
 * comparison. Dense row-major m×n storage (m ≥ n): entry (i, j) is a[i*n + j]. The compact
 * result follows LAPACK DGEQR2: R on and above the diagonal of `qr`, the Householder vector v_k
 * below the diagonal of column k (its leading 1 implied), and H_k = I − τ_k v_k v_kᵀ, so that
 * A = H_0 H_1 … H_{n−1} [R; 0].
 */

import { applyBlockReflector, formT } from '@sandbox/reference/householder-block-reflector.ts';

export interface HouseholderQr {
  qr: Float64Array;
  tau: Float64Array;
}

function checkInput(a: ArrayLike<number>, m: number, n: number): void {
  if (!Number.isInteger(n) || n < 0)
    throw new RangeError(`n must be a non-negative integer, got ${n}`);
  if (!Number.isInteger(m) || m < n) throw new RangeError(`m must be an integer ≥ n, got ${m}`);
  if (a.length !== m * n)
    throw new RangeError(`a must hold m*n = ${m * n} entries, has ${a.length}`);
  for (let k = 0; k < a.length; k++)
    if (!Number.isFinite(a[k]!)) throw new RangeError(`a must be finite; a[${k}] = ${a[k]}`);
}

/** ‖w[k+1…m−1, k]‖₂ with scaling against overflow and underflow (as LAPACK DNRM2 intends). */
function columnNormBelow(w: Float64Array, m: number, n: number, k: number): number {
  let scale = 0;
  for (let i = k + 1; i < m; i++) scale = Math.max(scale, Math.abs(w[i * n + k]!));
  if (scale === 0) return 0;
  let sum = 0;
  for (let i = k + 1; i < m; i++) {
    const t = w[i * n + k]! / scale;
    sum += t * t;
  }
  return scale * Math.sqrt(sum);
}

/**
 * Turns column k (rows k…m−1) into a reflector in place, LAPACK DLARFG's way: β on the
 * diagonal, v below it; returns τ (0 when the part below the diagonal is already zero).
 */
function makeReflector(w: Float64Array, m: number, n: number, k: number): number {
  const alpha = w[k * n + k]!;
  const xnorm = columnNormBelow(w, m, n, k);
  if (xnorm === 0) return 0;
  const beta = -Math.sign(alpha || 1) * Math.hypot(alpha, xnorm);
  const scale = 1 / (alpha - beta);
  for (let i = k + 1; i < m; i++) w[i * n + k] = w[i * n + k]! * scale;
  w[k * n + k] = beta;
  return (beta - alpha) / beta;
}

/**
 * A = QR by Householder reflections, column by column (LAPACK DGEQR2's method and sign
 * convention: β = −sign(α)·‖(α, x)‖₂, τ = (β − α)/β, v = x/(α − β); τ = 0 when x = 0;
 * Golub & Van Loan, Matrix Computations, 4th ed., §5.1.2 and §5.2.1, from memory).
 * Row-oriented application: for reflector k, wᵀ = v_kᵀ A(k:m, k+1:n) is accumulated row by row
 * (four rows per pass), then A(i, k+1:n) −= τ v_i wᵀ row by row, so every inner loop runs along
 * a row. Layout: a is m×n row-major with m ≥ n, finite, not mutated. Cost 2mn² − 2n³/3 flops.
 * The plain loop, kept as the specification of householderQr below.
 */
export function householderQrUnblocked(a: ArrayLike<number>, m: number, n: number): HouseholderQr {
  checkInput(a, m, n);
  const w = Float64Array.from(a);
  const tau = new Float64Array(n);
  const acc = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    const t = makeReflector(w, m, n, k);
    tau[k] = t;
    if (t !== 0 && k + 1 < n) applyReflector(w, m, n, k, t, acc, n);
  }
  return { qr: w, tau };
}

/** Columns per panel of the blocked QR (measured at n = 512: 32 beat 16 and 64). */
export const QR_PANEL_WIDTH = 32;

/**
 * A = QR by Householder reflections, blocked with the compact WY form (Schreiber & Van Loan
 * 1989; LAPACK DGEQRF with DLARFT and DLARFB; Golub & Van Loan, 4th ed., §5.2.3, from memory):
 * each panel of QR_PANEL_WIDTH columns is factored by the plain loop restricted to the panel,
 * its reflectors are gathered as I − V T Vᵀ (T upper triangular), and the trailing columns are
 * updated at once, A₂ ← A₂ − V (Tᵀ (Vᵀ A₂)), in two row-oriented passes that reuse each row of
 * A₂ for all the panel's reflectors. Same result format as householderQrUnblocked; the
 * reflectors and R agree with it to rounding (the sums are grouped differently).
 * Layout: a is m×n row-major with m ≥ n, finite, not mutated. Cost 2mn² − 2n³/3 flops plus
 * lower-order terms for T.
 */
export function householderQr(a: ArrayLike<number>, m: number, n: number): HouseholderQr {
  checkInput(a, m, n);
  const w = Float64Array.from(a);
  const tau = new Float64Array(n);
  const acc = new Float64Array(n);
  const nb = QR_PANEL_WIDTH;
  const t = new Float64Array(nb * nb);
  const wt = new Float64Array(nb * n);
  for (let k0 = 0; k0 < n; k0 += nb) {
    const k1 = Math.min(n, k0 + nb);
    for (let k = k0; k < k1; k++) {
      const tk = makeReflector(w, m, n, k);
      tau[k] = tk;
      if (tk !== 0 && k + 1 < k1) applyReflector(w, m, n, k, tk, acc, k1);
    }
    if (k1 === n) break;
    formT(w, m, n, k0, k1, tau, t, nb);
    applyBlockReflector(w, m, n, k0, k1, t, nb, wt);
  }
  return { qr: w, tau };
}

/** A(k:m, k+1:n) ← (I − τ v vᵀ) A(k:m, k+1:n), v = (1, w[k+1…m−1, k]). */
function applyReflector(
  w: Float64Array,
  m: number,
  n: number,
  k: number,
  t: number,
  acc: Float64Array,
  jEnd: number,
): void {
  const j0 = k + 1;
  const rk = k * n;
  for (let j = j0; j < jEnd; j++) acc[j] = w[rk + j]!;
  let i = k + 1;
  for (; i + 4 <= m; i += 4) {
    const r0 = i * n;
    const r1 = r0 + n;
    const r2 = r1 + n;
    const r3 = r2 + n;
    const v0 = w[r0 + k]!;
    const v1 = w[r1 + k]!;
    const v2 = w[r2 + k]!;
    const v3 = w[r3 + k]!;
    for (let j = j0; j < jEnd; j++)
      acc[j] = acc[j]! + v0 * w[r0 + j]! + v1 * w[r1 + j]! + v2 * w[r2 + j]! + v3 * w[r3 + j]!;
  }
  for (; i < m; i++) {
    const ri = i * n;
    const v = w[ri + k]!;
    for (let j = j0; j < jEnd; j++) acc[j] = acc[j]! + v * w[ri + j]!;
  }
  for (let j = j0; j < jEnd; j++) {
    acc[j] = acc[j]! * t;
    w[rk + j] = w[rk + j]! - acc[j]!;
  }
  for (i = k + 1; i < m; i++) {
    const ri = i * n;
    const v = w[ri + k]!;
    if (v === 0) continue;
    for (let j = j0; j < jEnd; j++) w[ri + j] = w[ri + j]! - v * acc[j]!;
  }
}

/**
 * The thin factor Q (m×n, row-major, orthonormal columns) from the compact result:
 * Q = H_0 … H_{n−1} applied to the first n columns of I, reflectors taken last to first
 * (LAPACK DORG2R's order). Cost 4mn² − 4n³/3 flops (Golub & Van Loan, 4th ed., §5.1.6, from memory).
 */
export function householderThinQ(f: HouseholderQr, m: number, n: number): Float64Array {
  const { qr, tau } = f;
  const q = new Float64Array(m * n);
  for (let j = 0; j < n; j++) q[j * n + j] = 1;
  const acc = new Float64Array(n);
  for (let k = n - 1; k >= 0; k--) {
    const t = tau[k]!;
    if (t === 0) continue;
    // Columns k…n−1 of Q(k:m, :) are the only non-trivial ones at this stage.
    for (let j = k; j < n; j++) acc[j] = q[k * n + j]!;
    for (let i = k + 1; i < m; i++) {
      const v = qr[i * n + k]!;
      if (v === 0) continue;
      for (let j = k; j < n; j++) acc[j] = acc[j]! + v * q[i * n + j]!;
    }
    for (let j = k; j < n; j++) {
      acc[j] = acc[j]! * t;
      q[k * n + j] = q[k * n + j]! - acc[j]!;
    }
    for (let i = k + 1; i < m; i++) {
      const v = qr[i * n + k]!;
      if (v === 0) continue;
      for (let j = k; j < n; j++) q[i * n + j] = q[i * n + j]! - v * acc[j]!;
    }
  }
  return q;
}

/** R (n×n, row-major, zeros below the diagonal) from the compact result. */
export function householderR(f: HouseholderQr, n: number): Float64Array {
  const r = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let j = i; j < n; j++) r[i * n + j] = f.qr[i * n + j]!;
  return r;
}
