/**
 * Double-double arithmetic: a value is the unevaluated sum hi + lo of two doubles with
 * |lo| ≤ ulp(hi)/2, giving about 106 significant bits (unit roundoff about 2^-104 for the
 * operations below). Built on the error-free transformations of `error-free.ts`.
 * Sources: T. J. Dekker, "A floating-point technique for extending the available precision",
 * Numer. Math. 18 (1971) 224–242 (add2, mul2, div2); Y. Hida, X. S. Li & D. H. Bailey,
 * "Algorithms for quad-double precision floating point arithmetic", ARITH-15 (2001), and their
 * QD library (the IEEE-style add with two TwoSums, the accurate division). Assumes binary64
 * round-to-nearest and no overflow or underflow, as the error-free transformations do.
 * The scalar operations take the parts as separate numbers and return a fresh [hi, lo] pair;
 * ddSubScaledInPlace updates arrays of parts in place (the inner loop of an elimination).
 */
import { twoProduct, twoSum } from '@sandbox/numerics/error-free.ts';

/** A double-double value hi + lo with |lo| ≤ ulp(hi)/2. */
export type DoubleDouble = [hi: number, lo: number];

/**
 * a + b = s + e exactly when |a| ≥ |b| (or a = 0), with s = fl(a + b). 3 flops.
 * Method: Dekker 1971 (FastTwoSum, "quick-two-sum" in QD); Knuth, TAOCP vol. 2, §4.2.2.
 */
export function fastTwoSum(a: number, b: number): DoubleDouble {
  const s = a + b;
  return [s, b - (s - a)];
}

/**
 * (ah + al) + (bh + bl), relative error about 2u² (QD's IEEE add: Hida, Li & Bailey 2001;
 * TwoSum of Knuth, TAOCP vol. 2, §4.2.2). About 20 flops.
 */
export function ddAdd(ah: number, al: number, bh: number, bl: number): DoubleDouble {
  const [s1, s2] = twoSum(ah, bh);
  const [t1, t2] = twoSum(al, bl);
  const [u1, u2] = fastTwoSum(s1, s2 + t1);
  return fastTwoSum(u1, u2 + t2);
}

/** (ah + al) − (bh + bl), as ddAdd with the second operand negated. */
export function ddSub(ah: number, al: number, bh: number, bl: number): DoubleDouble {
  return ddAdd(ah, al, -bh, -bl);
}

/**
 * (ah + al) · (bh + bl), relative error about 4u² (Dekker 1971, mul2; QD's dd·dd product,
 * Hida, Li & Bailey 2001): TwoProduct of the high parts plus the two cross terms; the al·bl
 * term is below the result's precision and dropped. About 25 flops.
 */
export function ddMul(ah: number, al: number, bh: number, bl: number): DoubleDouble {
  const [p, e] = twoProduct(ah, bh);
  return fastTwoSum(p, e + (ah * bl + al * bh));
}

/**
 * (ah + al) / (bh + bl) by three quotient digits with exact remainder updates (QD's accurate
 * division; Hida, Li & Bailey 2001; Dekker 1971, div2 uses two). Relative error about a few u².
 * Division by a zero divisor gives non-finite parts, as in double arithmetic.
 */
export function ddDiv(ah: number, al: number, bh: number, bl: number): DoubleDouble {
  const q1 = ah / bh;
  const [rh, rl] = ddSub(ah, al, ...ddMul(bh, bl, q1, 0));
  const q2 = rh / bh;
  const [sh] = ddSub(rh, rl, ...ddMul(bh, bl, q2, 0));
  const q3 = sh / bh;
  const [h, l] = fastTwoSum(q1, q2);
  return ddAdd(h, l, q3, 0);
}

const SPLITTER = 134217729; // 2^27 + 1, Veltkamp's constant (Dekker 1971).

/**
 * y_j ← y_j − s·x_j for j < len, all in double-double, where y_j = yHi[yOff + j] + yLo[yOff + j],
 * x_j likewise and s = sh + sl: the row update of an elimination. Same arithmetic as ddMul
 * followed by ddSub, written out in one loop (no pair allocation) because it is the inner loop
 * of a double-double LU. Cost about 45 flops per entry. Method: TwoProduct with Veltkamp's split
 * and TwoSum (Dekker 1971; Knuth, TAOCP vol. 2, §4.2.2) as in QD (Hida, Li & Bailey 2001).
 */
export function ddSubScaledInPlace(
  yHi: Float64Array,
  yLo: Float64Array,
  yOff: number,
  xHi: ArrayLike<number>,
  xLo: ArrayLike<number>,
  xOff: number,
  len: number,
  sh: number,
  sl: number,
): void {
  let c = SPLITTER * sh;
  const shh = c - (c - sh);
  const shl = sh - shh;
  for (let j = 0; j < len; j++) {
    const xh = xHi[xOff + j]!;
    const xl = xLo[xOff + j]!;
    // m = s·x by TwoProduct(sh, xh) plus the cross terms, then FastTwoSum (as ddMul).
    const p = sh * xh;
    c = SPLITTER * xh;
    const xhh = c - (c - xh);
    const xhl = xh - xhh;
    const e = shl * xhl - (p - shh * xhh - shl * xhh - shh * xhl) + (sh * xl + sl * xh);
    const mh = p + e;
    const ml = e - (mh - p);
    // y − m by two TwoSums and two FastTwoSums (as ddAdd with −m).
    const ah = yHi[yOff + j]!;
    const al = yLo[yOff + j]!;
    let s1 = ah - mh;
    let bb = s1 - ah;
    let s2 = ah - (s1 - bb) + (-mh - bb);
    const t1 = al - ml;
    bb = t1 - al;
    const t2 = al - (t1 - bb) + (-ml - bb);
    s2 += t1;
    let h = s1 + s2;
    s2 = s2 - (h - s1);
    s1 = h;
    s2 += t2;
    h = s1 + s2;
    yHi[yOff + j] = h;
    yLo[yOff + j] = s2 - (h - s1);
  }
}
