/**
 * Residual entries c − Σ_k x_k·y_k (and c − Σ_k x_k·d_k·y_k) evaluated as if in twice the
 * working precision and rounded once: the constant c and every product enter one compensated
 * sum, as in Dot2 (Ogita, Rump & Oishi, "Accurate sum and dot product", SIAM J. Sci. Comput.
 * 26(6), 2005, Alg. 5.3). Forming fl(Σ x_k y_k) first and subtracting c afterwards would cost
 * an error of u·|c|, the very size of the residual being measured (numerics.md, Conventions).
 * Vectors are read with an offset and a stride, so rows and columns of dense row-major
 * matrices (entry (i, j) of an m×n matrix at a[i*n + j]) are passed without copying.
 * Assumes no overflow or underflow in the products (scale first; see power-of-two-scale.ts).
 * Non-finite inputs give a non-finite or NaN result, never an exception.
 */
import { dot2Residual, twoProduct, twoSum } from '@sandbox/numerics/error-free.ts';

/**
 * (c + cLow) − Σ_{k<len} x[xOff + k·xStride]·y[yOff + k·yStride], with error at most
 * u·|result| + γ_{len+1}²·(|c| + Σ|x_k y_k|) (the error bound of Dot2 in Ogita, Rump & Oishi
 * 2005, §5, from memory). cLow carries the low part of an exact constant (e.g. from TwoSum).
 * Cost 25·len flops. Method: Dot2 with the constant in the compensated sum, dot2Residual of
 * error-free.ts (the hot loop of every factor residual, TwoProduct and TwoSum inlined there).
 */
export const residualDot2: typeof dot2Residual = dot2Residual;

/**
 * c − Σ_{k<len} x[xOff + k·xStride]·d[dOff + k]·y[yOff + k·yStride] in Dot2 precision: each
 * x_k·d_k is split exactly by TwoProduct into p + e, p·y_k is split again, and the small term
 * e·y_k (at most u·|x_k d_k y_k|) is rounded once, an error of u²·|x_k d_k y_k|, within Dot2's
 * bound. Cost about 45·len flops. Used for A − LDLᵀ (LAPACK dsyt01's residual).
 */
export function residualDot3(
  c: number,
  len: number,
  x: ArrayLike<number>,
  xOff: number,
  xStride: number,
  d: ArrayLike<number>,
  dOff: number,
  y: ArrayLike<number>,
  yOff: number,
  yStride: number,
): number {
  let p = c;
  let s = 0;
  for (let k = 0; k < len; k++) {
    const yk = y[yOff + k * yStride]!;
    const [p1, e1] = twoProduct(x[xOff + k * xStride]!, d[dOff + k]!);
    const [h, e2] = twoProduct(p1, yk);
    const [sum, q] = twoSum(p, -h);
    p = sum;
    s += q - e2 - e1 * yk;
  }
  return p + s;
}
