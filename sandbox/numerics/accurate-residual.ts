/**
 * Matrix-vector products and residuals r = b − A·x evaluated with Dot2 accuracy: each component
 * is computed as if in twice the working precision and then rounded (Ogita, Rump & Oishi,
 * "Accurate sum and dot product", SIAM J. Sci. Comput. 26(6) (2005) 1955–1988, Alg. 5.3; error
 * bound |r̂_i − r_i| ≤ u·|r_i| + γ_{n+1}²·(|b| + |A||x|)_i, their §5 (from memory)).
 * Dense row-major storage: entry (i, j) of the m×n matrix A is a[i*n + j]. Assumes no overflow
 * or underflow in the products (Veltkamp's split needs |a_ij|, |x_j| below about 2^996).
 * Inputs are not mutated.
 */
import { twoSum } from '@sandbox/numerics/error-free.ts';

const SPLITTER = 134217729; // 2^27 + 1, Veltkamp's constant (Dekker 1971).

function checkArguments(
  a: ArrayLike<number>,
  m: number,
  n: number,
  x: ArrayLike<number>,
  b: ArrayLike<number> | null,
): void {
  if (!Number.isInteger(m) || m < 0)
    throw new RangeError(`m must be a non-negative integer, got ${m}`);
  if (!Number.isInteger(n) || n < 0)
    throw new RangeError(`n must be a non-negative integer, got ${n}`);
  if (a.length !== m * n)
    throw new RangeError(`a must hold m*n = ${m * n} entries, has ${a.length}`);
  if (x.length !== n) throw new RangeError(`x must have length n = ${n}, has ${x.length}`);
  if (b !== null && b.length !== m)
    throw new RangeError(`b must have length m = ${m}, has ${b.length}`);
}

/**
 * Row i of c − A·x as an unevaluated pair (p, s): p is the floating-point sum, s the sum of all
 * rounding errors (TwoProduct of Dekker 1971 and TwoSum of Knuth, inlined as in Ogita, Rump &
 * Oishi 2005, Alg. 5.3). The value p + s is what Dot2 rounds.
 */
function rowSum(
  a: ArrayLike<number>,
  row: number,
  n: number,
  x: ArrayLike<number>,
  c: number,
): [p: number, s: number] {
  let p = c;
  let s = 0;
  for (let j = 0; j < n; j++) {
    const aij = -a[row + j]!;
    const xj = x[j]!;
    const h = aij * xj;
    // TwoProduct (Dekker 1971): aij·xj = h + r exactly.
    let t = SPLITTER * aij;
    const ah = t - (t - aij);
    const al = aij - ah;
    t = SPLITTER * xj;
    const xh = t - (t - xj);
    const xl = xj - xh;
    const r = al * xl - (h - ah * xh - al * xh - ah * xl);
    // TwoSum (Knuth): p + h = t + q exactly.
    t = p + h;
    const z = t - p;
    const q = p - (t - z) + (h - z);
    p = t;
    s += q + r;
  }
  return [p, s];
}

/**
 * r = b − A·x with each component accurate as if computed in twice the working precision, then
 * rounded to double.
 * Layout: A is m×n row-major (a[i*n + j]); x has length n, b length m; returns a new length-m
 * vector. Cost about 25·m·n flops. Method: Dot2 (Ogita, Rump & Oishi 2005, Alg. 5.3) on the
 * n + 1 terms b_i, −a_i1·x_1, …, −a_in·x_n.
 */
export function residualAccurate(
  a: ArrayLike<number>,
  m: number,
  n: number,
  x: ArrayLike<number>,
  b: ArrayLike<number>,
): Float64Array {
  checkArguments(a, m, n, x, b);
  const r = new Float64Array(m);
  for (let i = 0; i < m; i++) {
    const [p, s] = rowSum(a, i * n, n, x, b[i]!);
    r[i] = p + s;
  }
  return r;
}

/**
 * r = b − A·x as a double-double vector (hi + lo per component), for iterative refinement with a
 * correction solver that accepts double-double right-hand sides. hi is the Dot2 result (the
 * rounded residual); lo carries the next ~53 bits, accurate to about γ_{n+1}·u·(|b| + |A||x|)_i.
 * Layout as residualAccurate. Cost about 25·m·n flops. Method: Dot2's pair (p, s)
 * (Ogita, Rump & Oishi 2005, Alg. 5.3) renormalised with TwoSum (Knuth, TAOCP vol. 2, §4.2.2).
 */
export function residualAccurateDoubleDouble(
  a: ArrayLike<number>,
  m: number,
  n: number,
  x: ArrayLike<number>,
  b: ArrayLike<number>,
): { hi: Float64Array; lo: Float64Array } {
  checkArguments(a, m, n, x, b);
  const hi = new Float64Array(m);
  const lo = new Float64Array(m);
  for (let i = 0; i < m; i++) {
    const [p, s] = rowSum(a, i * n, n, x, b[i]!);
    // TwoSum gives hi = fl(p + s) and the exact remainder, so |lo| ≤ ulp(hi)/2.
    [hi[i], lo[i]] = twoSum(p, s);
  }
  return { hi, lo };
}

/**
 * y = A·x with each component accurate as if computed in twice the working precision, then
 * rounded. Layout: A is m×n row-major (a[i*n + j]); x has length n; returns a new length-m
 * vector. Cost about 25·m·n flops. Method: Dot2 (Ogita, Rump & Oishi 2005, Alg. 5.3).
 */
export function matVecAccurate(
  a: ArrayLike<number>,
  m: number,
  n: number,
  x: ArrayLike<number>,
): Float64Array {
  checkArguments(a, m, n, x, null);
  const y = new Float64Array(m);
  for (let i = 0; i < m; i++) {
    // rowSum computes c − A·x; with c = 0 the negated sum is A·x (negation is exact).
    const [p, s] = rowSum(a, i * n, n, x, 0);
    y[i] = 0 - (p + s); // 0 − v rather than −v, so that a zero result is +0.
  }
  return y;
}
