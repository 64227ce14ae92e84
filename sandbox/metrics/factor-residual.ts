/**
 * Accurate factorisation residuals and LAPACK's factor ratios. Dense row-major storage: entry
 * (i, j) of an m×n matrix is a[i*n + j]. Every residual entry is one Dot2-class compensated sum
 * (accurate-product.ts), because a residual formed in plain double can blame a correct kernel:
 * with large growth the rounding of the check's own product L·U exceeds the kernel's error.
 * The data are first scaled by a power of two (power-of-two-scale.ts), which leaves every ratio
 * unchanged and keeps the error-free products away from overflow and underflow.
 * Cost: LU n³/3 and Cholesky, LDLᵀ n³/6 compensated multiply-adds; QR m·n²/2.
 */
import { maxAbs, norm1 } from '@sandbox/numerics/norms.ts';
import { UNIT_ROUNDOFF } from '@sandbox/numerics/unit-roundoff.ts';
import { checkDimension, checkLength, checkPermutation } from './argument-checks.ts';
import { residualDot2, residualDot3 } from './accurate-product.ts';
import { powerOfTwoScale } from './power-of-two-scale.ts';
import { worstIfNaN } from './safe-ratio.ts';
import { maxAbsLower, symmetricNorm1Lower } from './symmetric-norm.ts';

/** A residual σ·(A − product of the factors) with the norms its ratios need. */
export interface FactorResidual {
  /** rows×cols residual, row-major; for Cholesky and LDLᵀ only the lower triangle is filled. */
  r: Float64Array;
  rows: number;
  cols: number;
  /** The power of two σ applied to A (and hence to the residual). */
  scale: number;
  /** ‖σ(A − product)‖₁; for Cholesky and LDLᵀ the symmetric 1-norm of the lower triangle. */
  normResidual: number;
  /** ‖σA‖₁, measured the same way. */
  normA: number;
}

/**
 * ‖residual‖₁ / (k·‖A‖₁·u), k = n for LU, Cholesky, LDLᵀ and max(1, m) for QR (LAPACK
 * TESTING/LIN dget01, dpot01, dsyt01, dqrt02; u = DLAMCH('E') = 2^-53). Evaluated as
 * ((‖R‖/k)/‖A‖)/u like dget01, so that no intermediate overflows. An exactly zero residual
 * gives 0; a nonzero residual with ‖A‖₁ = 0 gives 1/u (dget01 and dsyt01; dpot01 returns 1/u
 * even for a zero residual and dqrt02 returns 0, we use one rule for all four). A NaN gives ∞.
 */
export function factorRatio(residual: FactorResidual, k: number): number {
  const { normResidual, normA } = residual;
  if (Number.isNaN(normResidual) || Number.isNaN(normA)) return Infinity;
  if (normResidual === 0) return 0;
  if (normA === 0) return 1 / UNIT_ROUNDOFF;
  return worstIfNaN(normResidual / k / normA / UNIT_ROUNDOFF);
}

/**
 * PA − LU for the packed n×n factors `lu` (strict lower part L with unit diagonal, upper part
 * with diagonal U) and row i of PA = row perm[i] of A (product.md; no perm = identity).
 * Method: r_ij = σ·a_{perm[i], j} − Σ_{k ≤ min(i,j)} l_ik·(σu_kj) in Dot2 (LAPACK dget01 forms
 * the same residual in double).
 */
export function luResidual(
  a: ArrayLike<number>,
  n: number,
  lu: ArrayLike<number>,
  perm?: ArrayLike<number>,
): FactorResidual {
  checkSquare(a, n);
  checkLength('lu', lu, n * n);
  if (perm !== undefined) checkPermutation(perm, n);
  const sigma = powerOfTwoScale(maxAbs(a));
  // L with its unit diagonal, and σU stored transposed so that both are read with stride 1.
  const l = lowerCopy(lu, n, 1, true);
  const ut = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let j = i; j < n; j++) ut[j * n + i] = sigma * lu[i * n + j]!;
  const pa = new Float64Array(n * n);
  const r = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    const src = (perm === undefined ? i : perm[i]!) * n;
    for (let j = 0; j < n; j++) {
      const aij = sigma * a[src + j]!;
      pa[i * n + j] = aij;
      r[i * n + j] = residualDot2(aij, 0, Math.min(i, j) + 1, l, i * n, 1, ut, j * n, 1);
    }
  }
  return {
    r,
    rows: n,
    cols: n,
    scale: sigma,
    normResidual: norm1(r, n, n),
    normA: norm1(pa, n, n),
  };
}

/**
 * A − LLᵀ on the lower triangle, L the lower triangle of the n×n `l` (entries above the
 * diagonal ignored); A symmetric, lower triangle read. Method: σ chosen from √max|A| so that
 * σL and σ²A are both near 1; r_ij = σ²a_ij − Σ_{k≤j} (σl_ik)(σl_jk) in Dot2 (LAPACK dpot01).
 */
export function choleskyResidual(
  a: ArrayLike<number>,
  n: number,
  l: ArrayLike<number>,
): FactorResidual {
  checkSquare(a, n);
  checkLength('l', l, n * n);
  const sigma = powerOfTwoScale(Math.sqrt(maxAbsLower(a, n)), 511);
  const scale = sigma * sigma;
  const ls = lowerCopy(l, n, sigma, false);
  const as = lowerCopy(a, n, scale, false);
  const r = new Float64Array(n * n);
  for (let i = 0; i < n; i++)
    for (let j = 0; j <= i; j++)
      r[i * n + j] = residualDot2(as[i * n + j]!, 0, j + 1, ls, i * n, 1, ls, j * n, 1);
  return symmetricResidual(r, as, n, scale);
}

/**
 * A − LDLᵀ on the lower triangle, L unit lower (strict lower part of `l`), D = diag(d); A
 * symmetric, lower triangle read. Method: r_ij = σa_ij − Σ_{k≤j} l_ik·(σd_k)·l_jk with l_jj = 1,
 * each triple product split exactly (LAPACK dsyt01 with 1×1 pivots only).
 */
export function ldltResidual(
  a: ArrayLike<number>,
  n: number,
  l: ArrayLike<number>,
  d: ArrayLike<number>,
): FactorResidual {
  checkSquare(a, n);
  checkLength('l', l, n * n);
  checkLength('d', d, n);
  const sigma = powerOfTwoScale(maxAbsLower(a, n));
  const lu = lowerCopy(l, n, 1, true);
  const ds = Float64Array.from(d, (v) => sigma * v);
  const as = lowerCopy(a, n, sigma, false);
  const r = new Float64Array(n * n);
  for (let i = 0; i < n; i++)
    for (let j = 0; j <= i; j++)
      r[i * n + j] = residualDot3(as[i * n + j]!, j + 1, lu, i * n, 1, ds, 0, lu, j * n, 1);
  return symmetricResidual(r, as, n, sigma);
}

/**
 * A − QR for A m×n (m ≥ n), thin Q m×n and R the upper triangle of the n×n `r` (entries below
 * the diagonal ignored). Method: r_ij = σa_ij − Σ_{k≤j} q_ik·(σr_kj) in Dot2. LAPACK dqrt02
 * measures R − QᵀA instead, which equals Qᵀ(QR − A) only for an orthonormal Q; A − QR does not
 * assume what orthogonality.ts measures separately.
 */
export function qrResidual(
  a: ArrayLike<number>,
  m: number,
  n: number,
  q: ArrayLike<number>,
  r: ArrayLike<number>,
): FactorResidual {
  checkDimension('m', m);
  checkDimension('n', n);
  if (m < n) throw new RangeError(`m must be at least n, got m = ${m}, n = ${n}`);
  checkLength('a', a, m * n);
  checkLength('q', q, m * n);
  checkLength('r', r, n * n);
  const sigma = powerOfTwoScale(maxAbs(a));
  // σR stored transposed so that its columns are read with stride 1.
  const rt = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let j = i; j < n; j++) rt[j * n + i] = sigma * r[i * n + j]!;
  const as = Float64Array.from(a, (v) => sigma * v);
  const res = new Float64Array(m * n);
  for (let i = 0; i < m; i++)
    for (let j = 0; j < n; j++)
      res[i * n + j] = residualDot2(as[i * n + j]!, 0, j + 1, q, i * n, 1, rt, j * n, 1);
  return {
    r: res,
    rows: m,
    cols: n,
    scale: sigma,
    normResidual: norm1(res, m, n),
    normA: norm1(as, m, n),
  };
}

/** ‖PA − LU‖₁ / (n·‖A‖₁·u) (LAPACK dget01). */
export function luFactorRatio(
  a: ArrayLike<number>,
  n: number,
  lu: ArrayLike<number>,
  perm?: ArrayLike<number>,
): number {
  return factorRatio(luResidual(a, n, lu, perm), n);
}

/** ‖A − LLᵀ‖₁ / (n·‖A‖₁·u) (LAPACK dpot01). */
export function choleskyFactorRatio(a: ArrayLike<number>, n: number, l: ArrayLike<number>): number {
  return factorRatio(choleskyResidual(a, n, l), n);
}

/** ‖A − LDLᵀ‖₁ / (n·‖A‖₁·u) (LAPACK dsyt01). */
export function ldltFactorRatio(
  a: ArrayLike<number>,
  n: number,
  l: ArrayLike<number>,
  d: ArrayLike<number>,
): number {
  return factorRatio(ldltResidual(a, n, l, d), n);
}

/** ‖A − QR‖₁ / (max(1, m)·‖A‖₁·u) (normalisation of LAPACK dqrt02). */
export function qrFactorRatio(
  a: ArrayLike<number>,
  m: number,
  n: number,
  q: ArrayLike<number>,
  r: ArrayLike<number>,
): number {
  return factorRatio(qrResidual(a, m, n, q, r), Math.max(1, m));
}

function checkSquare(a: ArrayLike<number>, n: number): void {
  checkDimension('n', n);
  checkLength('a', a, n * n);
}

/** σ times the lower triangle of s (diagonal included, or set to 1 when unitDiagonal); zeros above. */
function lowerCopy(s: ArrayLike<number>, n: number, sigma: number, unitDiagonal: boolean) {
  const c = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < i; j++) c[i * n + j] = sigma * s[i * n + j]!;
    c[i * n + i] = unitDiagonal ? 1 : sigma * s[i * n + i]!;
  }
  return c;
}

function symmetricResidual(r: Float64Array, as: Float64Array, n: number, scale: number) {
  const normResidual = symmetricNorm1Lower(r, n);
  return { r, rows: n, cols: n, scale, normResidual, normA: symmetricNorm1Lower(as, n) };
}
