/**
 * Exact conversions between binary64 numbers and BigInt rationals. Every finite double is a
 * dyadic rational m·2^e with an integer m (IEEE 754-2019, §3.4), so a matrix of doubles is exactly
 * an integer matrix times one power of two.
 */

/** x = mantissa · 2^exponent exactly, with mantissa odd (or 0 with exponent 0). Cost O(1). */
export function dyadicParts(x: number): { mantissa: bigint; exponent: number } {
  if (!Number.isFinite(x)) throw new RangeError(`x must be finite, got ${x}`);
  if (x === 0) return { mantissa: 0n, exponent: 0 };
  const view = new DataView(new ArrayBuffer(8));
  view.setFloat64(0, x);
  const hi = view.getUint32(0);
  const lo = view.getUint32(4);
  const biased = (hi >>> 20) & 0x7ff;
  // Binary64 layout: sign, 11-bit biased exponent, 52-bit fraction (IEEE 754-2019, §3.4).
  let mantissa = (BigInt(hi & 0xfffff) << 32n) | BigInt(lo);
  let exponent: number;
  if (biased === 0) {
    exponent = -1074;
  } else {
    mantissa |= 1n << 52n;
    exponent = biased - 1075;
  }
  while ((mantissa & 1n) === 0n) {
    mantissa >>= 1n;
    exponent += 1;
  }
  return { mantissa: hi >>> 31 ? -mantissa : mantissa, exponent };
}

/**
 * The integer matrix M and exponent s with a[k] = M[k]·2^s exactly for every k; s is as large as
 * possible (the smallest exponent among the nonzero entries). Cost O(length) BigInt operations.
 */
export function scaledIntegers(a: ArrayLike<number>): { ints: bigint[]; exponent: number } {
  const parts: { mantissa: bigint; exponent: number }[] = [];
  let minExponent = Infinity;
  for (let k = 0; k < a.length; k++) {
    const p = dyadicParts(a[k]!);
    parts.push(p);
    if (p.mantissa !== 0n && p.exponent < minExponent) minExponent = p.exponent;
  }
  if (minExponent === Infinity) return { ints: parts.map(() => 0n), exponent: 0 };
  const ints = parts.map((p) =>
    p.mantissa === 0n ? 0n : p.mantissa << BigInt(p.exponent - minExponent),
  );
  return { ints, exponent: minExponent };
}

function bitLength(x: bigint): number {
  return x === 0n ? 0 : (x < 0n ? -x : x).toString(2).length;
}

/** Largest bit length of |x| over the entries (0 for an all-zero list). */
export function maxBitLength(ints: readonly bigint[]): number {
  let bits = 0;
  for (const x of ints) bits = Math.max(bits, bitLength(x));
  return bits;
}

/**
 * num/den rounded to the nearest double (ties to even), for den ≠ 0. Method: scale so that the
 * integer quotient has at least 55 significant bits, fold the remainder into a sticky bit, and let
 * Number() round that integer once (ECMA-262, Number(bigint) gives the nearest double); the final
 * scaling by a power of two is exact unless the result overflows or is subnormal.
 */
export function rationalToNumber(num: bigint, den: bigint): number {
  if (den === 0n) throw new RangeError('den must not be zero');
  if (num === 0n) return 0;
  const negative = num < 0n !== den < 0n;
  const p = num < 0n ? -num : num;
  const q = den < 0n ? -den : den;
  const shift = 56 - (bitLength(p) - bitLength(q));
  const scaledP = shift > 0 ? p << BigInt(shift) : p;
  const scaledQ = shift < 0 ? q << BigInt(-shift) : q;
  const quotient = scaledP / scaledQ;
  const sticky = scaledP % scaledQ === 0n ? 0n : 1n;
  const rounded = Number((quotient << 1n) | sticky);
  // Two steps, so that 2^e itself never overflows or underflows when the product would not.
  const e = -(shift + 1);
  const half = Math.trunc(e / 2);
  const value = rounded * 2 ** half * 2 ** (e - half);
  return negative ? -value : value;
}
