/**
 * The residual r = b − A·x̂ of a computed solution, evaluated accurately on a scaled copy of the
 * system. Dense row-major n×n storage: entry (i, j) of A at a[i*n + j].
 */
import { maxAbs } from '@sandbox/numerics/norms.ts';
import { checkDimension, checkLength } from './argument-checks.ts';
import { residualDot2 } from './accurate-product.ts';
import { powerOfTwoScale } from './power-of-two-scale.ts';

/** A scaled system A' = τA, x' = ξx̂, b' = τξb and its residual r' = b' − A'x' = τξ(b − Ax̂). */
export interface ScaledSolveResidual {
  a: Float64Array;
  x: Float64Array;
  b: Float64Array;
  r: Float64Array;
}

/**
 * Scales A, x̂ and b by powers of two τ (from max|A|) and ξ (from max(|x̂|, τ|b|)) so that the
 * largest entries are near 1, then forms each r'_i = b'_i − Σ_j a'_ij·x'_j in Dot2 (Ogita, Rump
 * & Oishi 2005, Alg. 5.3). The scaling is exact (barring underflow of entries far below the
 * largest) and every backward error and residual ratio is homogeneous of degree 0 in (τ, ξ), so
 * they are computed on the scaled copy without overflow. Cost 25·n² flops. Non-finite entries
 * give non-finite or NaN residuals, never an exception.
 */
export function scaledSolveResidual(
  a: ArrayLike<number>,
  n: number,
  x: ArrayLike<number>,
  b: ArrayLike<number>,
): ScaledSolveResidual {
  checkDimension('n', n);
  checkLength('a', a, n * n);
  checkLength('x', x, n);
  checkLength('b', b, n);
  const tau = powerOfTwoScale(maxAbs(a));
  const xi = powerOfTwoScale(Math.max(maxAbs(x), tau * maxAbs(b)));
  const as = Float64Array.from(a, (v) => tau * v);
  const xs = Float64Array.from(x, (v) => xi * v);
  const bs = Float64Array.from(b, (v) => xi * (tau * v)); // not (τξ)·v, which could underflow
  const r = new Float64Array(n);
  for (let i = 0; i < n; i++) r[i] = residualDot2(bs[i]!, 0, n, as, i * n, 1, xs, 0, 1);
  return { a: as, x: xs, b: bs, r };
}
