import { norm1 } from '@sandbox/numerics/norms.ts';
import { UNIT_ROUNDOFF } from '@sandbox/numerics/unit-roundoff.ts';
import {
  lowerTriangle,
  matmul,
  permuteRows,
  transpose,
  unpackLu,
  upperTriangle,
} from '@tests/helpers/dense-matrix.ts';

/**
 * Plain-double residual ratios for checking a kernel's factors loosely. Dense row-major: entry
 * (i, j) of an m×n matrix is a[i*n + j]. The ratios follow LAPACK's test ratios (dget01, dpot01,
 * dsyt01, dqrt01/dqrt02): a sound kernel on a well-conditioned matrix gives a ratio of order 1;
 * the pass threshold is 30 (dtest.in).
 */
export const RATIO_THRESHOLD = 30;

/** ‖A − C‖₁ / (scale·‖A‖₁·u) for m×n A and C. */
function differenceRatio(a: Float64Array, c: Float64Array, m: number, n: number, scale: number) {
  const d = a.map((v, i) => v - c[i]!);
  return norm1(d, m, n) / (scale * norm1(a, m, n) * UNIT_ROUNDOFF);
}

/** ‖PA − LU‖₁ / (n‖A‖₁u), LAPACK dget01; perm undefined means P = I. */
export function luRatio(
  a: Float64Array,
  lu: Float64Array,
  perm: Int32Array | undefined,
  n: number,
) {
  const { l, u } = unpackLu(lu, n);
  const pa = perm ? permuteRows(a, perm, n) : a;
  return differenceRatio(pa, matmul(l, u, n, n, n), n, n, n);
}

/** ‖A − LLᵀ‖₁ / (n‖A‖₁u), LAPACK dpot01 (L's upper part ignored). */
export function choleskyRatio(a: Float64Array, l: Float64Array, n: number) {
  const low = lowerTriangle(l, n);
  return differenceRatio(a, matmul(low, transpose(low, n, n), n, n, n), n, n, n);
}

/** ‖A − LDLᵀ‖₁ / (n‖A‖₁u), LAPACK dsyt01 style (L unit lower from its strict part). */
export function ldltRatio(a: Float64Array, l: Float64Array, d: Float64Array, n: number) {
  const low = lowerTriangle(l, n, true);
  const ld = low.map((v, k) => v * d[k % n]!);
  return differenceRatio(a, matmul(ld, transpose(low, n, n), n, n, n), n, n, n);
}

/** ‖A − QR‖₁ / (m‖A‖₁u) and ‖I − QᵀQ‖₁ / (m·u), LAPACK dqrt02 and dqrt01. */
export function qrRatios(a: Float64Array, q: Float64Array, r: Float64Array, m: number, n: number) {
  const factor = differenceRatio(a, matmul(q, upperTriangle(r, n), m, n, n), m, n, m);
  const qtq = matmul(transpose(q, m, n), q, n, m, n);
  for (let i = 0; i < n; i++) qtq[i * n + i] = qtq[i * n + i]! - 1;
  return { factor, orthogonality: norm1(qtq, n, n) / (m * UNIT_ROUNDOFF) };
}

/** ‖b − Ux‖₁ / (‖U‖₁‖x‖₁u), LAPACK dget02 style. */
export function solveRatio(u: Float64Array, b: Float64Array, x: Float64Array, n: number) {
  const ux = matmul(upperTriangle(u, n), x, n, n, 1);
  const r = b.map((v, i) => v - ux[i]!);
  return norm1(r, n, 1) / (norm1(u, n, n) * norm1(x, n, 1) * UNIT_ROUNDOFF);
}
