/** Exact rational arithmetic for the matrix tests: BigInt numerator and positive denominator. */
export interface Fraction {
  num: bigint;
  den: bigint;
}

function gcd(a: bigint, b: bigint): bigint {
  let x = a < 0n ? -a : a;
  let y = b < 0n ? -b : b;
  while (y !== 0n) [x, y] = [y, x % y];
  return x;
}

export function frac(num: bigint | number, den: bigint | number = 1n): Fraction {
  let p = BigInt(num);
  let q = BigInt(den);
  if (q === 0n) throw new RangeError('zero denominator');
  if (q < 0n) [p, q] = [-p, -q];
  const g = gcd(p, q) || 1n;
  return { num: p / g, den: q / g };
}

export const add = (a: Fraction, b: Fraction) => frac(a.num * b.den + b.num * a.den, a.den * b.den);
export const sub = (a: Fraction, b: Fraction) => frac(a.num * b.den - b.num * a.den, a.den * b.den);
export const mul = (a: Fraction, b: Fraction) => frac(a.num * b.num, a.den * b.den);
export const div = (a: Fraction, b: Fraction) => frac(a.num * b.den, a.den * b.num);
export const equals = (a: Fraction, b: Fraction) => a.num === b.num && a.den === b.den;

/** n×n product of fraction matrices (row-major). */
export function matMul(a: Fraction[], b: Fraction[], n: number): Fraction[] {
  const c: Fraction[] = [];
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      let s = frac(0);
      for (let k = 0; k < n; k++) s = add(s, mul(a[i * n + k]!, b[k * n + j]!));
      c.push(s);
    }
  }
  return c;
}

/** Whether a fraction matrix is the identity. */
export function isIdentity(a: Fraction[], n: number): boolean {
  return a.every((x, k) => (Math.floor(k / n) === k % n ? equals(x, frac(1)) : x.num === 0n));
}

/** Determinant by exact Gaussian elimination with row exchanges on fractions. */
export function determinant(a0: Fraction[], n: number): Fraction {
  const a = a0.slice();
  let det = frac(1);
  for (let k = 0; k < n; k++) {
    let p = k;
    while (p < n && a[p * n + k]!.num === 0n) p++;
    if (p === n) return frac(0);
    if (p !== k) {
      for (let j = 0; j < n; j++) [a[k * n + j], a[p * n + j]] = [a[p * n + j]!, a[k * n + j]!];
      det = frac(-det.num, det.den);
    }
    const pivot = a[k * n + k]!;
    det = mul(det, pivot);
    for (let i = k + 1; i < n; i++) {
      const l = div(a[i * n + k]!, pivot);
      for (let j = k; j < n; j++) a[i * n + j] = sub(a[i * n + j]!, mul(l, a[k * n + j]!));
    }
  }
  return det;
}
