/**
 * Error-free transformations in binary64 with round-to-nearest, assuming no overflow or
 * underflow. Sources: Knuth, TAOCP vol. 2, §4.2.2 (TwoSum); Dekker 1971 and Veltkamp (Split,
 * TwoProduct); Ogita, Rump & Oishi, "Accurate sum and dot product", SISC 26(6), 2005 (Dot2).
 * JavaScript has no fused multiply-add, so TwoProduct uses Veltkamp's split.
 */

/** a + b = s + e exactly, with s = fl(a + b) (Knuth's TwoSum, 6 flops, no branch). */
export function twoSum(a: number, b: number): [s: number, e: number] {
  const s = a + b;
  const bb = s - a;
  const e = a - (s - bb) + (b - bb);
  return [s, e];
}

const SPLITTER = 134217729; // 2^27 + 1 (Veltkamp)

/** a = hi + lo with hi, lo holding at most 26 significant bits each (Veltkamp split). */
export function split(a: number): [hi: number, lo: number] {
  const c = SPLITTER * a;
  const hi = c - (c - a);
  return [hi, a - hi];
}

/** a · b = p + e exactly, with p = fl(a · b) (Dekker's TwoProduct, 17 flops). */
export function twoProduct(a: number, b: number): [p: number, e: number] {
  const p = a * b;
  const [ah, al] = split(a);
  const [bh, bl] = split(b);
  const e = al * bl - (p - ah * bh - al * bh - ah * bl);
  return [p, e];
}

/**
 * (c + cLow) − Σ_{k<n} x[xOff + k·xStride]·y[yOff + k·yStride] as if computed in twice the
 * working precision, then rounded: the constant and every product enter one compensated sum
 * (Ogita, Rump & Oishi 2005, Algorithm 5.3, Dot2), with error at most u·|result| +
 * γ_{n+1}²·(|c| + Σ|x_k y_k|) (their §5, from memory). cLow carries the low part of an exact
 * constant (e.g. from TwoSum). Cost 25·n flops. Method: TwoProduct and TwoSum inlined in the loop,
 * the hot loop of every accurate residual (the tuple-returning helpers above allocate per call).
 */
export function dot2Residual(
  c: number,
  cLow: number,
  n: number,
  x: ArrayLike<number>,
  xOff: number,
  xStride: number,
  y: ArrayLike<number>,
  yOff: number,
  yStride: number,
): number {
  let p = c;
  let s = cLow;
  for (let k = 0; k < n; k++) {
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
 * Dot product as if computed in twice the working precision, then rounded (Ogita, Rump &
 * Oishi 2005, Algorithm 5.3, Dot2). Reads x[xOff + k·xStride] and y[yOff + k·yStride].
 * Method: −dot2Residual(0, 0, …). Round-to-nearest is symmetric and negation exact, so every
 * nonzero intermediate is the exact negation of Dot2's own and the result is Dot2's bit for bit;
 * adding +0 turns a zero result into +0, the sign Dot2 gives it.
 */
export function dot2(
  n: number,
  x: ArrayLike<number>,
  xOff: number,
  xStride: number,
  y: ArrayLike<number>,
  yOff: number,
  yStride: number,
): number {
  return -dot2Residual(0, 0, n, x, xOff, xStride, y, yOff, yStride) + 0;
}
