/**
 * The engine's own Cholesky factorisation A = LLᵀ in double, for benchmarks and as a trusted
 * comparison. Dense row-major n×n storage: entry (i, j) is a[i*n + j]; only the lower triangle
 * of A is read. The work is done on R = Lᵀ, the upper triangle in row-major order, so that
 * every inner loop runs along a row (the same shape as the LU update); L is Rᵀ at the end.
 */
import { subtractRowProducts } from '@sandbox/reference/row-block-update.ts';

/** The factor L (lower triangular, positive diagonal, zeros above), or the failing column. */
export type CholeskyResult =
  { ok: true; l: Float64Array } | { ok: false; reason: 'not-positive-definite'; column: number };

/** Rows per panel of the blocked Cholesky (measured beside GEPP_PANEL_WIDTH; same reasons). */
export const CHOLESKY_PANEL_WIDTH = 32;

function checkInput(a: ArrayLike<number>, n: number): void {
  if (!Number.isInteger(n) || n < 0)
    throw new RangeError(`n must be a non-negative integer, got ${n}`);
  if (a.length !== n * n)
    throw new RangeError(`a must hold n*n = ${n * n} entries, has ${a.length}`);
  for (let i = 0; i < n; i++)
    for (let j = 0; j <= i; j++)
      if (!Number.isFinite(a[i * n + j]!))
        throw new RangeError(`a must be finite; a[${i * n + j}] = ${a[i * n + j]}`);
}

/** R's work array: w[i*n + j] = a[j*n + i] for j ≥ i (the lower triangle, transposed), else 0. */
function upperFromLower(a: ArrayLike<number>, n: number): Float64Array {
  const w = new Float64Array(n * n);
  for (let j = 0; j < n; j++) for (let i = 0; i <= j; i++) w[i * n + j] = a[j * n + i]!;
  return w;
}

function lowerFromUpper(w: Float64Array, n: number): Float64Array {
  const l = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let j = i; j < n; j++) l[j * n + i] = w[i * n + j]!;
  return l;
}

/**
 * Step k of the right-looking factorisation on R, applied to rows k+1…rowEnd−1 only: r_kk = √w_kk,
 * r_kj = w_kj / r_kk for j > k, then w_ij ← w_ij − r_ki·r_kj for k < i < rowEnd, j ≥ i.
 * Returns false when w_kk is not positive (A is not positive definite, or rounding made it so).
 */
function step(w: Float64Array, n: number, k: number, rowEnd: number): boolean {
  const rk = k * n;
  const d = w[rk + k]!;
  if (!(d > 0)) return false;
  const r = Math.sqrt(d);
  w[rk + k] = r;
  for (let j = k + 1; j < n; j++) w[rk + j] = w[rk + j]! / r;
  for (let i = k + 1; i < rowEnd; i++) {
    const ri = i * n;
    const l = w[rk + i]!;
    for (let j = i; j < n; j++) w[ri + j] = w[ri + j]! - l * w[rk + j]!;
  }
  return true;
}

/**
 * A = LLᵀ by the right-looking (outer-product) algorithm, unblocked: the specification of the
 * blocked routine below (Golub & Van Loan, Matrix Computations, 4th ed., §4.2, from memory).
 * Layout: a is n×n row-major, only its lower triangle is read, it must be finite and is not
 * mutated. Cost n³/3 flops. Stops at the first step k whose pivot w_kk is not positive and
 * returns { ok: false, column: k } (LAPACK DPOTRF's INFO = k + 1).
 */
export function choleskyFactorUnblocked(a: ArrayLike<number>, n: number): CholeskyResult {
  checkInput(a, n);
  const w = upperFromLower(a, n);
  for (let k = 0; k < n; k++)
    if (!step(w, n, k, n)) return { ok: false, reason: 'not-positive-definite', column: k };
  return { ok: true, l: lowerFromUpper(w, n) };
}

/**
 * A = LLᵀ, blocked right-looking: for each panel of CHOLESKY_PANEL_WIDTH rows of R, the
 * unblocked steps restricted to the panel's rows (which also finish the panel's rows right of
 * the diagonal block), then one update of the trailing upper triangle, w_ij ← w_ij − Σ_p r_pi·r_pj
 * over the panel's rows p in increasing order. Each entry receives the same operations in the
 * same order as in choleskyFactorUnblocked, so the factors are bit-for-bit equal.
 * Layout, cost and return value as choleskyFactorUnblocked.
 */
export function choleskyFactor(a: ArrayLike<number>, n: number): CholeskyResult {
  checkInput(a, n);
  const w = upperFromLower(a, n);
  for (let k0 = 0; k0 < n; k0 += CHOLESKY_PANEL_WIDTH) {
    const k1 = Math.min(n, k0 + CHOLESKY_PANEL_WIDTH);
    for (let k = k0; k < k1; k++)
      if (!step(w, n, k, k1)) return { ok: false, reason: 'not-positive-definite', column: k };
    if (k1 < n) updateTrailingUpper(w, n, k0, k1);
  }
  return { ok: true, l: lowerFromUpper(w, n) };
}

/**
 * w_ij ← w_ij − Σ_{p ∈ [k0, k1)} r_pi·r_pj for k1 ≤ i ≤ j < n, term by term in increasing p.
 * The multipliers r_pi are column i of the panel; they are gathered into the strictly-lower
 * part of row i (w_ip, p < k1 ≤ i, unused by R) so that the row-block kernel can read them
 * along the row, and zeroed again afterwards. Each row i updates only j ≥ i: the kernel runs on
 * pairs of rows from column i + 1 after the lone entry (i, i).
 */
function updateTrailingUpper(w: Float64Array, n: number, k0: number, k1: number): void {
  for (let i = k1; i < n; i++) for (let p = k0; p < k1; p++) w[i * n + p] = w[p * n + i]!;
  let i = k1;
  for (; i + 2 <= n; i += 2) {
    // Entry (i, i) alone, then rows i and i + 1 together from column i + 1.
    const ri = i * n;
    for (let p = k0; p < k1; p++) w[ri + i] = w[ri + i]! - w[ri + p]! * w[p * n + i]!;
    subtractRowProducts(w, n, i, i + 2, k0, k1, i + 1, n);
  }
  if (i < n) subtractRowProducts(w, n, i, i + 1, k0, k1, i, n);
  for (let r = k1; r < n; r++) w.fill(0, r * n + k0, r * n + k1);
}
