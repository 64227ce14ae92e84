import {
  maxBitLength,
  rationalToNumber,
  scaledIntegers,
} from '@sandbox/matrices/exact-integers.ts';

/**
 * Exact facts about a small stored matrix, computed in BigInt arithmetic on the doubles exactly
 * as stored (so for Hilbert they describe fl(H), not H; references §4.1 shows why that matters).
 */

/** The exact inverse of an integer matrix: inverse = adjugate / det (det may be negative). */
export interface ExactIntegerInverse {
  det: bigint;
  /** det · A⁻¹, row-major n×n integers (the adjugate when det ≠ 0). Empty when det = 0. */
  adjugate: bigint[];
  /** Signs of the leading principal minors of orders 1..k, up to the first zero one included. */
  leadingMinorSigns: number[];
}

/**
 * Determinant, adjugate and leading principal minor signs of an integer n×n matrix. Layout:
 * row-major, entry (i, j) at m[i*n + j]. Cost: about 2n³ BigInt operations on numbers of up to
 * n·(bits + log₂n) bits. Method: fraction-free Gauss–Jordan elimination on [M | I] (E. H. Bareiss,
 * "Sylvester's identity and multistep integer-preserving Gaussian elimination", Math. Comp. 22
 * (1968) 565–578): every division is exact, the k-th pivot is the k-th leading principal minor
 * until a row exchange is needed, and the end state is [d·I | d·M⁻¹] with d = ±det M.
 */
export function exactIntegerInverse(m: readonly bigint[], n: number): ExactIntegerInverse {
  if (!Number.isInteger(n) || n < 1) throw new RangeError(`n must be a positive integer, got ${n}`);
  if (m.length !== n * n) throw new RangeError(`m must hold n*n = ${n * n} entries`);
  const w = 2 * n;
  const t: bigint[] = new Array<bigint>(n * w).fill(0n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) t[i * w + j] = m[i * n + j]!;
    t[i * w + n + i] = 1n;
  }
  const signs: number[] = [];
  let recording = true;
  let sign = 1n;
  let prev = 1n;
  for (let k = 0; k < n; k++) {
    let p = k;
    while (p < n && t[p * w + k] === 0n) p++;
    if (recording) {
      signs.push(p === k ? (t[k * w + k]! > 0n ? 1 : -1) : 0);
      if (p !== k) recording = false;
    }
    if (p === n) return { det: 0n, adjugate: [], leadingMinorSigns: signs };
    if (p !== k) {
      for (let j = 0; j < w; j++) {
        const x = t[k * w + j]!;
        t[k * w + j] = t[p * w + j]!;
        t[p * w + j] = x;
      }
      sign = -sign;
    }
    const pivot = t[k * w + k]!;
    const rk = k * w;
    for (let i = 0; i < n; i++) {
      if (i === k) continue;
      const ri = i * w;
      const f = t[ri + k]!;
      for (let j = 0; j < w; j++) {
        if (j === k) continue;
        const a = t[ri + j]!;
        const b = t[rk + j]!;
        // Bareiss step: (pivot·a − f·b) / previous pivot, exact by Sylvester's identity.
        if (b === 0n || f === 0n) {
          if (a !== 0n) t[ri + j] = (pivot * a) / prev;
        } else {
          t[ri + j] = (pivot * a - f * b) / prev;
        }
      }
      t[ri + k] = 0n;
    }
    prev = pivot;
  }
  // prev = det of the row-permuted matrix; the right block is prev · M⁻¹.
  const adjugate: bigint[] = new Array<bigint>(n * n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) adjugate[i * n + j] = t[i * w + n + j]!;
  return {
    det: sign * prev,
    adjugate: sign < 0n ? adjugate.map((x) => -x) : adjugate,
    leadingMinorSigns: signs,
  };
}

/** What exactFacts reports about a stored square matrix. */
export interface ExactFacts {
  /** det(A) = 0 exactly. */
  singular: boolean;
  /** κ₁(A) = ‖A‖₁·‖A⁻¹‖₁ rounded to the nearest double; undefined when singular. */
  condition1?: number;
  /** Exact κ₁ as a fraction num/den (den > 0); undefined when singular. */
  condition1Fraction?: { num: bigint; den: bigint };
  /** Order (1-based) of the first leading principal minor that is exactly zero, if any. */
  firstZeroLeadingMinor?: number;
  /** All leading principal minors are positive: for a symmetric matrix, positive definite (Sylvester's criterion). */
  leadingMinorsPositive: boolean;
}

/** Default work limit for exactFacts: keeps one call to roughly a tenth of a second (measured). */
export const EXACT_WORK_LIMIT = 3e5;

/** Estimated cost of exactFacts: n³ · max(1, n·bits/64) (BigInt operations times limbs). */
export function exactWork(n: number, bits: number): number {
  return n ** 3 * Math.max(1, (n * bits) / 64);
}

function gcd(a: bigint, b: bigint): bigint {
  let x = a < 0n ? -a : a;
  let y = b < 0n ? -b : b;
  while (y !== 0n) [x, y] = [y, x % y];
  return x;
}

function colSumsMax(m: readonly bigint[], n: number): bigint {
  let best = 0n;
  for (let j = 0; j < n; j++) {
    let s = 0n;
    for (let i = 0; i < n; i++) {
      const x = m[i * n + j]!;
      s += x < 0n ? -x : x;
    }
    if (s > best) best = s;
  }
  return best;
}

/**
 * Exact facts about the stored n×n matrix a (row-major, entry (i, j) at a[i*n + j]), or undefined
 * when the estimated work exceeds maxWork. κ₁ = ‖M‖₁·‖adj M‖₁/|det M| for the integer matrix
 * M = 2^-s·A (the scale cancels); ‖·‖₁ is the largest column sum (Golub & Van Loan, 4th ed., §2.3.2).
 */
export function exactFacts(
  a: ArrayLike<number>,
  n: number,
  maxWork = EXACT_WORK_LIMIT,
): ExactFacts | undefined {
  if (a.length !== n * n)
    throw new RangeError(`a must hold n*n = ${n * n} entries, has ${a.length}`);
  if (exactWork(n, 0) > maxWork) return undefined; // Too large whatever the entries: skip the conversion.
  const { ints } = scaledIntegers(a);
  if (exactWork(n, maxBitLength(ints)) > maxWork) return undefined;
  const inv = exactIntegerInverse(ints, n);
  const zeroAt = inv.leadingMinorSigns.indexOf(0);
  const leadingMinorsPositive =
    inv.leadingMinorSigns.length === n && inv.leadingMinorSigns.every((s) => s > 0);
  const firstZero = zeroAt >= 0 ? { firstZeroLeadingMinor: zeroAt + 1 } : {};
  if (inv.det === 0n) return { singular: true, leadingMinorsPositive: false, ...firstZero };
  const rawNum = colSumsMax(ints, n) * colSumsMax(inv.adjugate, n);
  const rawDen = inv.det < 0n ? -inv.det : inv.det;
  const g = gcd(rawNum, rawDen);
  const num = rawNum / g;
  const den = rawDen / g;
  return {
    singular: false,
    condition1: rationalToNumber(num, den),
    condition1Fraction: { num, den },
    leadingMinorsPositive,
    ...firstZero,
  };
}
