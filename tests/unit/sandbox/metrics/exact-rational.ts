/**
 * Exact rational arithmetic on BigInt fractions, for check values that the tests compute
 * independently of the code under test. Every double is a dyadic rational, so residuals of
 * factors given as doubles can be formed exactly.
 */

export interface Rational {
  num: bigint;
  /** Always positive; the fraction is kept in lowest terms. */
  den: bigint;
}

function gcd(a: bigint, b: bigint): bigint {
  let x = a < 0n ? -a : a;
  let y = b < 0n ? -b : b;
  while (y !== 0n) [x, y] = [y, x % y];
  return x;
}

export function rational(num: bigint, den = 1n): Rational {
  if (den === 0n) throw new RangeError('zero denominator');
  const sign = den < 0n ? -1n : 1n;
  const g = gcd(num, den) || 1n;
  return { num: (sign * num) / g, den: (sign * den) / g };
}

export const ZERO = rational(0n);
export const ONE = rational(1n);

/** The exact value of a finite double (IEEE 754 binary64: sign, 11-bit exponent, 52-bit fraction). */
export function fromDouble(x: number): Rational {
  if (!Number.isFinite(x)) throw new RangeError(`not finite: ${x}`);
  const view = new DataView(new ArrayBuffer(8));
  view.setFloat64(0, x);
  const bits = view.getBigUint64(0);
  const negative = bits >> 63n === 1n;
  const exponent = Number((bits >> 52n) & 0x7ffn);
  const fraction = bits & ((1n << 52n) - 1n);
  const mantissa = exponent === 0 ? fraction : fraction | (1n << 52n);
  const e = (exponent === 0 ? 1 : exponent) - 1075;
  const signed = negative ? -mantissa : mantissa;
  return e >= 0 ? rational(signed << BigInt(e)) : rational(signed, 1n << BigInt(-e));
}

export function add(a: Rational, b: Rational): Rational {
  return rational(a.num * b.den + b.num * a.den, a.den * b.den);
}
export function sub(a: Rational, b: Rational): Rational {
  return rational(a.num * b.den - b.num * a.den, a.den * b.den);
}
export function mul(a: Rational, b: Rational): Rational {
  return rational(a.num * b.num, a.den * b.den);
}
export function div(a: Rational, b: Rational): Rational {
  return rational(a.num * b.den, a.den * b.num);
}
export function abs(a: Rational): Rational {
  return a.num < 0n ? { num: -a.num, den: a.den } : a;
}
export function compare(a: Rational, b: Rational): number {
  const d = a.num * b.den - b.num * a.den;
  return d < 0n ? -1 : d > 0n ? 1 : 0;
}
export function max(a: Rational, b: Rational): Rational {
  return compare(a, b) >= 0 ? a : b;
}
export function sum(values: Rational[]): Rational {
  return values.reduce(add, ZERO);
}

function bitLength(v: bigint): number {
  return v === 0n ? 0 : v.toString(2).length;
}

/** The nearest double, to within about one unit in the last place (enough for test tolerances). */
export function toDouble(a: Rational): number {
  if (a.num === 0n) return 0;
  const negative = a.num < 0n;
  const n = negative ? -a.num : a.num;
  // Shift so that the integer quotient carries about 64 significant bits.
  const shift = 64 - (bitLength(n) - bitLength(a.den));
  const q = shift >= 0 ? (n << BigInt(shift)) / a.den : n / (a.den << BigInt(-shift));
  let value = Number(q);
  let s = shift;
  while (s > 0) {
    const step = Math.min(s, 1000);
    value *= 2 ** -step;
    s -= step;
  }
  while (s < 0) {
    const step = Math.min(-s, 1000);
    value *= 2 ** step;
    s += step;
  }
  return negative ? -value : value;
}

/** u = 2^-53 as a rational (LAPACK DLAMCH('E'), INSTALL/dlamch.f). */
export const UNIT_ROUNDOFF_EXACT = rational(1n, 1n << 53n);

/** ‖M‖₁ of an m×n matrix of rationals, row-major (max column sum). */
export function norm1Exact(mat: Rational[], m: number, n: number): Rational {
  let best = ZERO;
  for (let j = 0; j < n; j++) {
    let s = ZERO;
    for (let i = 0; i < m; i++) s = add(s, abs(mat[i * n + j]!));
    best = max(best, s);
  }
  return best;
}

/** Exact product of row-major double matrices: (m×k)·(k×n). */
export function matmulExact(
  a: ArrayLike<number>,
  b: ArrayLike<number>,
  m: number,
  k: number,
  n: number,
): Rational[] {
  const out: Rational[] = [];
  for (let i = 0; i < m; i++)
    for (let j = 0; j < n; j++) {
      let s = ZERO;
      for (let p = 0; p < k; p++)
        s = add(s, mul(fromDouble(a[i * k + p]!), fromDouble(b[p * n + j]!)));
      out.push(s);
    }
  return out;
}
