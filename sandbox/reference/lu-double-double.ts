/**
 * LU factorisation with partial pivoting carried out in double-double arithmetic (about 106
 * significant bits), and the solve with its factors; the reference solver's fallback for
 * matrices on which refinement with double factors does not converge. Dense row-major n×n
 * storage: entry (i, j) is at [i*n + j]. The factor is held as two arrays hi and lo with
 * value hi + lo per entry, packed like GEPP's (L strictly below the diagonal with unit diagonal
 * implied, U on and above); row i of PA is row perm[i] of A.
 */
import { ddDiv, ddMul, ddSub, ddSubScaledInPlace } from '@sandbox/numerics/double-double.ts';

/** Double-double GEPP factors, or the first exactly zero pivot (0-based column index). */
export type LuDoubleDoubleResult =
  | { ok: true; hi: Float64Array; lo: Float64Array; perm: Int32Array }
  | { ok: false; reason: 'singular'; column: number };

function swapRows(v: Float64Array, n: number, k: number, p: number): void {
  for (let j = 0; j < n; j++) {
    const t = v[k * n + j]!;
    v[k * n + j] = v[p * n + j]!;
    v[p * n + j] = t;
  }
}

/**
 * PA = LU in double-double arithmetic, right-looking (kij) order.
 * Layout: a is n×n row-major (a[i*n + j]) of doubles and is not mutated. Cost 2n³/3
 * double-double operations (roughly 20 times a double GEPP).
 * Method: Gaussian elimination with partial pivoting (Golub & Van Loan, 4th ed., §3.4.3, from
 * memory); the pivot is the first row of maximal |hi| (a pivot choice need only bound the
 * multipliers); every operation is a double-double one (Dekker 1971; Hida, Li & Bailey 2001).
 * Returns `{ ok: false, reason: 'singular', column: k }` at the first exactly zero pivot.
 */
export function luFactorDoubleDouble(a: ArrayLike<number>, n: number): LuDoubleDoubleResult {
  if (!Number.isInteger(n) || n < 0)
    throw new RangeError(`n must be a non-negative integer, got ${n}`);
  if (a.length !== n * n)
    throw new RangeError(`a must hold n*n = ${n * n} entries, has ${a.length}`);
  const hi = Float64Array.from(a);
  const lo = new Float64Array(n * n);
  const perm = new Int32Array(n);
  for (let i = 0; i < n; i++) perm[i] = i;
  for (let k = 0; k < n; k++) {
    let p = k;
    let max = Math.abs(hi[k * n + k]!);
    for (let i = k + 1; i < n; i++) {
      const v = Math.abs(hi[i * n + k]!);
      if (v > max) {
        max = v;
        p = i;
      }
    }
    if (max === 0) return { ok: false, reason: 'singular', column: k };
    if (p !== k) {
      swapRows(hi, n, k, p);
      swapRows(lo, n, k, p);
      const t = perm[k]!;
      perm[k] = perm[p]!;
      perm[p] = t;
    }
    const ph = hi[k * n + k]!;
    const pl = lo[k * n + k]!;
    for (let i = k + 1; i < n; i++) {
      const [lh, ll] = ddDiv(hi[i * n + k]!, lo[i * n + k]!, ph, pl);
      hi[i * n + k] = lh;
      lo[i * n + k] = ll;
      if (lh !== 0)
        ddSubScaledInPlace(hi, lo, i * n + k + 1, hi, lo, k * n + k + 1, n - k - 1, lh, ll);
    }
  }
  return { ok: true, hi, lo, perm };
}

/**
 * Solves A x = b in double-double from the factors of luFactorDoubleDouble: x = U⁻¹ L⁻¹ P b.
 * Layout: factors as returned (hi, lo packed n×n row-major); the right-hand side is bHi + bLo
 * (length n each, not mutated); returns x as hi + lo. Cost 2n² double-double operations.
 * Method: forward and back substitution (Golub & Van Loan, 4th ed., §3.1, from memory) with
 * double-double operations (Hida, Li & Bailey 2001).
 */
export function luSolveDoubleDouble(
  factors: { hi: Float64Array; lo: Float64Array; perm: Int32Array },
  bHi: ArrayLike<number>,
  bLo: ArrayLike<number>,
  n: number,
): { hi: Float64Array; lo: Float64Array } {
  const { hi, lo, perm } = factors;
  if (!Number.isInteger(n) || n < 0)
    throw new RangeError(`n must be a non-negative integer, got ${n}`);
  if (hi.length !== n * n || lo.length !== n * n || perm.length !== n)
    throw new RangeError(`factors must be for order n = ${n}`);
  if (bHi.length !== n || bLo.length !== n)
    throw new RangeError(`bHi and bLo must have length n = ${n}`);
  const xh = new Float64Array(n);
  const xl = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let sh = bHi[perm[i]!]!;
    let sl = bLo[perm[i]!]!;
    for (let j = 0; j < i; j++) {
      const [mh, ml] = ddMul(hi[i * n + j]!, lo[i * n + j]!, xh[j]!, xl[j]!);
      [sh, sl] = ddSub(sh, sl, mh, ml);
    }
    xh[i] = sh;
    xl[i] = sl;
  }
  for (let i = n - 1; i >= 0; i--) {
    let sh = xh[i]!;
    let sl = xl[i]!;
    for (let j = i + 1; j < n; j++) {
      const [mh, ml] = ddMul(hi[i * n + j]!, lo[i * n + j]!, xh[j]!, xl[j]!);
      [sh, sl] = ddSub(sh, sl, mh, ml);
    }
    [xh[i], xl[i]] = ddDiv(sh, sl, hi[i * n + i]!, lo[i * n + i]!);
  }
  return { hi: xh, lo: xl };
}
