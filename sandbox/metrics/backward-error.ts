/**
 * Backward errors of a computed solution x̂ of Ax = b, from an accurate residual
 * r = b − Ax̂ (solve-residual.ts). Dense row-major n×n storage: entry (i, j) at a[i*n + j].
 * Each function accepts a residual already computed by scaledSolveResidual, to share it.
 * Cost O(n²). Results are never NaN: a value that cannot be computed is ∞ (safe-ratio.ts).
 */
import { norm1, normInf, vectorNorm1, vectorNormInf } from '@sandbox/numerics/norms.ts';
import { UNIT_ROUNDOFF } from '@sandbox/numerics/unit-roundoff.ts';
import { ratioOrWorst, worstIfNaN } from './safe-ratio.ts';
import { scaledSolveResidual, type ScaledSolveResidual } from './solve-residual.ts';

/**
 * Normwise backward error η = ‖r‖∞ / (‖A‖∞‖x̂‖∞ + ‖b‖∞), the smallest ε with
 * (A + ΔA)x̂ = b + Δb, ‖ΔA‖ ≤ ε‖A‖, ‖Δb‖ ≤ ε‖b‖ (Rigal & Gaches, J. ACM 14, 1967; Higham, ASNA
 * 2nd ed., §7.1, Thm 7.1, from memory). 0/0 := 0.
 */
export function normwiseBackwardError(
  a: ArrayLike<number>,
  n: number,
  x: ArrayLike<number>,
  b: ArrayLike<number>,
  s: ScaledSolveResidual = scaledSolveResidual(a, n, x, b),
): number {
  const den = normInf(s.a, n, n) * vectorNormInf(s.x) + vectorNormInf(s.b);
  return ratioOrWorst(vectorNormInf(s.r), den);
}

/**
 * Componentwise backward error ω = max_i |r_i| / (|A||x̂| + |b|)_i with 0/0 := 0 and
 * (nonzero)/0 := ∞, the smallest ε with (A + ΔA)x̂ = b + Δb, |ΔA| ≤ ε|A|, |Δb| ≤ ε|b| (Oettli &
 * Prager, Numer. Math. 6, 1964; Higham, ASNA 2nd ed., §7.2, Thm 7.3, from memory). For back
 * substitution a backward stable solve gives ω ≤ γ_n (Higham, ASNA 2nd ed., Thm 8.5, from
 * memory). Unlike LAPACK's DGERFS there is no SAFE1 guard for tiny denominators; the scaling
 * keeps the largest entries near 1.
 */
export function componentwiseBackwardError(
  a: ArrayLike<number>,
  n: number,
  x: ArrayLike<number>,
  b: ArrayLike<number>,
  s: ScaledSolveResidual = scaledSolveResidual(a, n, x, b),
): number {
  let worst = 0;
  for (let i = 0; i < n; i++) {
    let den = Math.abs(s.b[i]!);
    for (let j = 0; j < n; j++) den += Math.abs(s.a[i * n + j]!) * Math.abs(s.x[j]!);
    worst = Math.max(worst, ratioOrWorst(Math.abs(s.r[i]!), den));
  }
  return worst;
}

/**
 * ‖r‖₁ / (‖A‖₁·‖x̂‖₁·u), LAPACK's solve ratio (TESTING/LIN dget02; u = DLAMCH('E') = 2^-53),
 * evaluated as ((‖r‖/‖A‖)/‖x̂‖)/u like dget02. n = 0 gives 0 (dget02's quick exit). An exactly
 * zero residual gives 0; otherwise ‖A‖₁ = 0 or ‖x̂‖₁ = 0 gives 1/u as in dget02 (which returns
 * 1/u for those even when the residual is zero).
 */
export function solveResidualRatio(
  a: ArrayLike<number>,
  n: number,
  x: ArrayLike<number>,
  b: ArrayLike<number>,
  s: ScaledSolveResidual = scaledSolveResidual(a, n, x, b),
): number {
  const normR = vectorNorm1(s.r);
  const normA = norm1(s.a, n, n);
  const normX = vectorNorm1(s.x);
  if (Number.isNaN(normR) || Number.isNaN(normA) || Number.isNaN(normX)) return Infinity;
  if (normR === 0) return 0;
  if (normA === 0 || normX === 0) return 1 / UNIT_ROUNDOFF;
  return worstIfNaN(normR / normA / normX / UNIT_ROUNDOFF);
}
