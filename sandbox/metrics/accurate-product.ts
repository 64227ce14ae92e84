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
import { twoProduct, twoSum } from '@sandbox/numerics/error-free.ts';

const SPLITTER = 134217729; // 2^27 + 1, Veltkamp's split (Dekker 1971), as in error-free.ts.

/**
 * (c + cLow) − Σ_{k<len} x[xOff + k·xStride]·y[yOff + k·yStride], with error at most
 * u·|result| + γ_{len+1}²·(|c| + Σ|x_k y_k|) (the error bound of Dot2 in Ogita, Rump & Oishi
 * 2005, §5, from memory). cLow carries the low part of an exact constant (e.g. from TwoSum).
 * Cost 25·len flops. Method: Dot2 with TwoProduct and TwoSum inlined in the loop (the hot loop of
 * every factor residual; the tuple-returning helpers of error-free.ts allocate per call).
 */
export function residualDot2(
  c: number,
  cLow: number,
  len: number,
  x: ArrayLike<number>,
  xOff: number,
  xStride: number,
  y: ArrayLike<number>,
  yOff: number,
  yStride: number,
): number {
  let p = c;
  let s = cLow;
  for (let k = 0; k < len; k++) {
    const a = x[xOff + k * xStride]!;
    const b = y[yOff + k * yStride]!;
    const h = a * b;
    // TwoProduct(a, b) = h + e exactly (Dekker 1971, mul12).
    let t = SPLITTER * a;
    const ah = t - (t - a);
    const al = a - ah;
    t = SPLITTER * b;
    const bh = t - (t - b);
    const bl = b - bh;
    const e = al * bl - (h - ah * bh - al * bh - ah * bl);
    // TwoSum(p, −h) = sum + q exactly (Knuth, TAOCP vol. 2, §4.2.2).
    const sum = p - h;
    const z = sum - p;
    const q = p - (sum - z) - (h + z);
    p = sum;
    s += q - e;
  }
  return p + s;
}

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
