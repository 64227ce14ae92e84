/**
 * Exact rational arithmetic on BigInt for tests: every finite double is a dyadic rational
 * m·2^e, so a matrix given as doubles can be solved, inverted, multiplied and its residuals
 * formed exactly, and the engine's floating-point results compared with the exact values (check
 * values computed independently of the code under test). Matrices are dense row-major arrays of
 * Rational: entry (i, j) of an m×n matrix at [i*n + j]. Meant for small n (≲ 20).
 */

/** num/den in lowest terms with den > 0. */
export interface Rational {
  readonly num: bigint;
  readonly den: bigint;
}

function gcd(a: bigint, b: bigint): bigint {
  let x = a < 0n ? -a : a;
  let y = b < 0n ? -b : b;
  while (y !== 0n) [x, y] = [y, x % y];
  return x;
}

/** num/den reduced to lowest terms; throws RangeError for den = 0. */
export function rational(num: bigint | number, den: bigint | number = 1n): Rational {
  let p = BigInt(num);
  let q = BigInt(den);
  if (q === 0n) throw new RangeError('den must not be zero');
  if (q < 0n) [p, q] = [-p, -q];
  const g = gcd(p, q);
  return g > 1n ? { num: p / g, den: q / g } : { num: p, den: q };
}

export const ZERO: Rational = { num: 0n, den: 1n };
export const ONE: Rational = { num: 1n, den: 1n };

/** The exact value of a finite double (Number.isInteger after exact doublings). */
export function fromDouble(x: number): Rational {
  if (!Number.isFinite(x)) throw new RangeError(`x must be finite, got ${x}`);
  let m = x;
  let e = 0n;
  // Doubling is exact for finite doubles and reaches an integer after at most 1074 steps.
  while (!Number.isInteger(m)) {
    m *= 2;
    e++;
  }
  return rational(BigInt(m), 1n << e);
}

/** Exact values of an array of doubles. */
export function fromDoubles(a: ArrayLike<number>): Rational[] {
  return Array.from(a, fromDouble);
}

export const add = (a: Rational, b: Rational): Rational =>
  rational(a.num * b.den + b.num * a.den, a.den * b.den);
export const sub = (a: Rational, b: Rational): Rational =>
  rational(a.num * b.den - b.num * a.den, a.den * b.den);
export const mul = (a: Rational, b: Rational): Rational => rational(a.num * b.num, a.den * b.den);
export const div = (a: Rational, b: Rational): Rational => {
  if (b.num === 0n) throw new RangeError('division by zero');
  return rational(a.num * b.den, a.den * b.num);
};
export const neg = (a: Rational): Rational => ({ num: -a.num, den: a.den });
export const abs = (a: Rational): Rational => (a.num < 0n ? neg(a) : a);
export const isZero = (a: Rational): boolean => a.num === 0n;
export const equals = (a: Rational, b: Rational): boolean => a.num === b.num && a.den === b.den;

/** −1, 0 or 1 as a < b, a = b, a > b. */
export function compare(a: Rational, b: Rational): number {
  const d = a.num * b.den - b.num * a.den;
  return d < 0n ? -1 : d > 0n ? 1 : 0;
}
export const max = (a: Rational, b: Rational): Rational => (compare(a, b) >= 0 ? a : b);
export const sum = (values: readonly Rational[]): Rational => values.reduce(add, ZERO);

/** u = 2^-53 as a rational (LAPACK DLAMCH('E'), INSTALL/dlamch.f). */
export const UNIT_ROUNDOFF_EXACT: Rational = { num: 1n, den: 1n << 53n };

function bitLength(x: bigint): number {
  return x === 0n ? 0 : x.toString(2).length;
}

/**
 * The double nearest to a (ties to even), for values in the normal range: a quotient with at
 * least 55 bits and a sticky bit is rounded once by Number(bigint), then scaled exactly.
 */
export function toNumber(a: Rational): number {
  if (a.num === 0n) return 0;
  const sign = a.num < 0n ? -1 : 1;
  const p = a.num < 0n ? -a.num : a.num;
  const shift = 56 - (bitLength(p) - bitLength(a.den)); // quotient gets 55 or 56 bits
  const scaledNum = shift >= 0 ? p << BigInt(shift) : p;
  const scaledDen = shift >= 0 ? a.den : a.den << BigInt(-shift);
  const q = scaledNum / scaledDen;
  const sticky = q * scaledDen === scaledNum ? 0n : 1n;
  let v = Number((q << 1n) | sticky);
  let e = -shift - 1;
  while (e > 1000) [v, e] = [v * 2 ** 1000, e - 1000];
  while (e < -1000) [v, e] = [v * 2 ** -1000, e + 1000];
  return sign * v * 2 ** e;
}

/** C = A·B exactly; A is m×k, B is k×n, row-major. */
export function matMulExact(
  a: readonly Rational[],
  b: readonly Rational[],
  m: number,
  k: number,
  n: number,
): Rational[] {
  const c: Rational[] = [];
  for (let i = 0; i < m; i++)
    for (let j = 0; j < n; j++) {
      let s = ZERO;
      for (let l = 0; l < k; l++) s = add(s, mul(a[i * k + l]!, b[l * n + j]!));
      c.push(s);
    }
  return c;
}

/**
 * Gauss–Jordan elimination in place on the n×w row-major m (w ≥ n), with the first nonzero pivot
 * (any pivot is exact here) and each pivot row scaled to a unit pivot. Returns the determinant of
 * the leading n×n block, ZERO when it is singular (m is then left partly reduced).
 */
function gaussJordan(m: Rational[], n: number, w: number): Rational {
  let det = ONE;
  for (let k = 0; k < n; k++) {
    let r = k;
    while (r < n && isZero(m[r * w + k]!)) r++;
    if (r === n) return ZERO;
    if (r !== k) {
      for (let j = 0; j < w; j++) [m[k * w + j], m[r * w + j]] = [m[r * w + j]!, m[k * w + j]!];
      det = neg(det);
    }
    const pivot = m[k * w + k]!;
    det = mul(det, pivot);
    for (let j = k; j < w; j++) m[k * w + j] = div(m[k * w + j]!, pivot);
    for (let i = 0; i < n; i++) {
      if (i === k || isZero(m[i * w + k]!)) continue;
      const f = m[i * w + k]!;
      for (let j = k; j < w; j++) m[i * w + j] = sub(m[i * w + j]!, mul(f, m[k * w + j]!));
    }
  }
  return det;
}

/** det A exactly, for an n×n A (Gauss–Jordan elimination on a copy). */
export function determinantExact(a: readonly Rational[], n: number): Rational {
  return gaussJordan(a.slice(), n, n);
}

/** Solves A X = B exactly for an n×n A and n×p B. Returns null when A is singular. */
export function solveExactMany(
  a: readonly Rational[],
  n: number,
  b: readonly Rational[],
  p: number,
): Rational[] | null {
  const w = p + n;
  // Augmented [A | B], row-major with w columns.
  const m: Rational[] = [];
  for (let i = 0; i < n; i++) m.push(...a.slice(i * n, i * n + n), ...b.slice(i * p, i * p + p));
  if (isZero(gaussJordan(m, n, w))) return null;
  const x: Rational[] = [];
  for (let i = 0; i < n; i++) x.push(...m.slice(i * w + n, i * w + w));
  return x;
}

/** x with A x = b exactly, or null when A is singular. */
export function solveExact(
  a: readonly Rational[],
  n: number,
  b: readonly Rational[],
): Rational[] | null {
  return solveExactMany(a, n, b, 1);
}

/** The n×n identity. */
function identity(n: number): Rational[] {
  return Array.from({ length: n * n }, (_, k) => (k % (n + 1) === 0 ? ONE : ZERO));
}

/** Whether the n×n matrix a is exactly the identity. */
export function isIdentity(a: readonly Rational[], n: number): boolean {
  const id = identity(n);
  return a.length === id.length && a.every((x, k) => equals(x, id[k]!));
}

/** A⁻¹ exactly (n×n row-major), or null when A is singular. */
export function inverseExact(a: readonly Rational[], n: number): Rational[] | null {
  return solveExactMany(a, n, identity(n), n);
}

/** ‖A‖₁ = max_j Σ_i |a_ij| exactly, for an m×n matrix. */
export function norm1Exact(a: readonly Rational[], m: number, n: number): Rational {
  let best = ZERO;
  for (let j = 0; j < n; j++) {
    let s = ZERO;
    for (let i = 0; i < m; i++) s = add(s, abs(a[i * n + j]!));
    best = max(best, s);
  }
  return best;
}

/** κ₁(A) = ‖A‖₁‖A⁻¹‖₁ exactly, or null when A is singular. */
export function condition1Exact(a: readonly Rational[], n: number): Rational | null {
  const inv = inverseExact(a, n);
  return inv === null ? null : mul(norm1Exact(a, n, n), norm1Exact(inv, n, n));
}
