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
 * Dot product as if computed in twice the working precision, then rounded (Ogita, Rump &
 * Oishi 2005, Algorithm 5.3, Dot2). Reads x[xOff + k·xStride] and y[yOff + k·yStride].
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
  let p = 0;
  let s = 0;
  for (let k = 0; k < n; k++) {
    const a = x[xOff + k * xStride]!;
    const b = y[yOff + k * yStride]!;
    const h = a * b;
    // TwoProduct inline.
    let c = SPLITTER * a;
    const ah = c - (c - a);
    const al = a - ah;
    c = SPLITTER * b;
    const bh = c - (c - b);
    const bl = b - bh;
    const r = al * bl - (h - ah * bh - al * bh - ah * bl);
    // TwoSum inline.
    const t = p + h;
    const z = t - p;
    const q = p - (t - z) + (h - z);
    p = t;
    s += q + r;
  }
  return p + s;
}
