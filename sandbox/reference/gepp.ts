/**
 * The reference solver's own LU factorisation with partial pivoting (GEPP) in double, and the
 * solves with its factors. Dense row-major n×n storage: entry (i, j) is a[i*n + j]. The packed
 * factor `lu` holds L (unit lower triangular, diagonal implied) strictly below the diagonal and
 * U on and above it; row i of PA is row perm[i] of A (product.md's convention), so PA = LU.
 */
import { subtractRowProducts } from '@sandbox/reference/row-block-update.ts';
import {
  solveLowerUnit,
  solveLowerUnitTransposed,
  solveUpper,
} from '@sandbox/numerics/triangular-solve.ts';

/** GEPP factors, or the first exactly zero pivot (0-based column index). */
export type GeppResult =
  | { ok: true; lu: Float64Array; perm: Int32Array }
  | { ok: false; reason: 'singular'; column: number };

function checkSquare(a: ArrayLike<number>, n: number, name: string): void {
  if (!Number.isInteger(n) || n < 0)
    throw new RangeError(`n must be a non-negative integer, got ${n}`);
  if (a.length !== n * n)
    throw new RangeError(`${name} must hold n*n = ${n * n} entries, has ${a.length}`);
}

function checkVector(b: ArrayLike<number>, n: number, name: string): void {
  if (b.length !== n) throw new RangeError(`${name} must have length n = ${n}, has ${b.length}`);
}

function checkPermutation(perm: Int32Array, n: number): void {
  if (perm.length !== n) throw new RangeError(`perm must have length n = ${n}, has ${perm.length}`);
  for (let i = 0; i < n; i++)
    if (perm[i]! < 0 || perm[i]! >= n) throw new RangeError(`perm[${i}] = ${perm[i]} out of range`);
}

/**
 * PA = LU by Gaussian elimination with partial pivoting, right-looking (kij) order.
 * Layout: a is n×n row-major (a[i*n + j]) and is not mutated. Cost 2n³/3 flops.
 * Method: at step k the pivot is the first row i ≥ k of maximal |a_ik| (the lowest index among
 * equal magnitudes, as LAPACK's IDAMAX), rows are swapped, multipliers l_ik = a_ik/a_kk stored,
 * and the trailing block updated (Golub & Van Loan, Matrix Computations, 4th ed., §3.4.3;
 * Higham, ASNA 2nd ed., §9.1, from memory). Stops at the first exactly zero pivot and returns
 * `{ ok: false, reason: 'singular', column: k }`, like LAPACK DGETF2's INFO = k + 1.
 * Non-finite entries propagate; the caller decides what to do with them.
 * This is the plain loop, kept as the specification of the blocked routine below.
 */
export function luFactorPartialPivotingUnblocked(a: ArrayLike<number>, n: number): GeppResult {
  checkSquare(a, n, 'a');
  const lu = Float64Array.from(a);
  const perm = new Int32Array(n);
  for (let i = 0; i < n; i++) perm[i] = i;
  for (let k = 0; k < n; k++) {
    // First maximum: strict '>' keeps the lowest row index among ties.
    let p = k;
    let max = Math.abs(lu[k * n + k]!);
    for (let i = k + 1; i < n; i++) {
      const v = Math.abs(lu[i * n + k]!);
      if (v > max) {
        max = v;
        p = i;
      }
    }
    if (max === 0) return { ok: false, reason: 'singular', column: k };
    if (p !== k) {
      for (let j = 0; j < n; j++) {
        const t = lu[k * n + j]!;
        lu[k * n + j] = lu[p * n + j]!;
        lu[p * n + j] = t;
      }
      const t = perm[k]!;
      perm[k] = perm[p]!;
      perm[p] = t;
    }
    const pivot = lu[k * n + k]!;
    for (let i = k + 1; i < n; i++) {
      const l = lu[i * n + k]! / pivot;
      lu[i * n + k] = l;
      if (l === 0) continue;
      for (let j = k + 1; j < n; j++) lu[i * n + j]! -= l * lu[k * n + j]!;
    }
  }
  return { ok: true, lu, perm };
}

/** Columns per panel of the blocked GEPP (measured at n = 512 and 1024: 32 beat 16, 64 and 128). */
export const GEPP_PANEL_WIDTH = 32;

/**
 * PA = LU by GEPP, blocked right-looking (LAPACK DGETRF's shape): for each panel of
 * GEPP_PANEL_WIDTH columns, the elimination restricted to the panel, by halves down to
 * PANEL_BASE_WIDTH columns (whole rows are swapped), then the panel's rows of U to its right (a unit lower triangular solve), then one
 * update of the trailing block (row-block-update.ts). Every entry receives the same operations
 * in the same order as in luFactorPartialPivotingUnblocked, so the factors, the permutation and
 * the singular column are identical (as numbers: only the sign of a zero may differ, where the
 * plain loop skips a zero multiplier). If the input or the result holds a non-finite value,
 * the plain loop is run instead, so that Inf and NaN propagate exactly as there.
 * Layout, cost and return value as luFactorPartialPivotingUnblocked; a is not mutated.
 */
export function luFactorPartialPivoting(a: ArrayLike<number>, n: number): GeppResult {
  checkSquare(a, n, 'a');
  for (let k = 0; k < a.length; k++)
    if (!Number.isFinite(a[k]!)) return luFactorPartialPivotingUnblocked(a, n);
  const lu = Float64Array.from(a);
  const perm = new Int32Array(n);
  for (let i = 0; i < n; i++) perm[i] = i;
  for (let k0 = 0; k0 < n; k0 += GEPP_PANEL_WIDTH) {
    const k1 = Math.min(n, k0 + GEPP_PANEL_WIDTH);
    const singular = factorPanelRecursive(lu, perm, n, k0, k1);
    if (singular >= 0) return { ok: false, reason: 'singular', column: singular };
    if (k1 === n) break;
    for (let r = k0 + 1; r < k1; r++) subtractRowProducts(lu, n, r, r + 1, k0, r, k1, n);
    subtractRowProducts(lu, n, k1, n, k0, k1, k1, n);
  }
  for (let k = 0; k < lu.length; k++)
    if (!Number.isFinite(lu[k]!)) return luFactorPartialPivotingUnblocked(a, n);
  return { ok: true, lu, perm };
}

/** Panels this narrow or narrower are eliminated column by column (measured at n = 512: 4 beat 2, 8 and 16). */
const PANEL_BASE_WIDTH = 4;

/**
 * Columns k0…k1−1 eliminated in place by halves (the recursive panel of LAPACK DGETRF2, Toledo,
 * SIAM J. Matrix Anal. Appl. 18(4), 1997): the left half, then the right half's rows of U and
 * its update through the row-block kernel, then the right half. Each entry still receives its
 * updates one at a time in increasing pivot order, as in factorPanel. Returns as factorPanel.
 */
function factorPanelRecursive(
  lu: Float64Array,
  perm: Int32Array,
  n: number,
  k0: number,
  k1: number,
): number {
  if (k1 - k0 <= PANEL_BASE_WIDTH) return factorPanel(lu, perm, n, k0, k1);
  const mid = k0 + ((k1 - k0) >> 1);
  const singular = factorPanelRecursive(lu, perm, n, k0, mid);
  if (singular >= 0) return singular;
  for (let r = k0 + 1; r < mid; r++) subtractRowProducts(lu, n, r, r + 1, k0, r, mid, k1);
  subtractRowProducts(lu, n, mid, n, k0, mid, mid, k1);
  return factorPanelRecursive(lu, perm, n, mid, k1);
}

/**
 * The unblocked elimination of columns k0…k1−1 in place, updating only those columns (rows are
 * swapped whole). Returns the first column with an exactly zero pivot, or −1.
 */
function factorPanel(
  lu: Float64Array,
  perm: Int32Array,
  n: number,
  k0: number,
  k1: number,
): number {
  for (let k = k0; k < k1; k++) {
    let p = k;
    let max = Math.abs(lu[k * n + k]!);
    for (let i = k + 1; i < n; i++) {
      const v = Math.abs(lu[i * n + k]!);
      if (v > max) {
        max = v;
        p = i;
      }
    }
    if (max === 0) return k;
    if (p !== k) {
      const rk = k * n;
      const rp = p * n;
      for (let j = 0; j < n; j++) {
        const t = lu[rk + j]!;
        lu[rk + j] = lu[rp + j]!;
        lu[rp + j] = t;
      }
      const t = perm[k]!;
      perm[k] = perm[p]!;
      perm[p] = t;
    }
    const rk = k * n;
    const pivot = lu[rk + k]!;
    for (let i = k + 1; i < n; i++) {
      const ri = i * n;
      const l = lu[ri + k]! / pivot;
      lu[ri + k] = l;
      if (l === 0) continue;
      for (let j = k + 1; j < k1; j++) lu[ri + j] = lu[ri + j]! - l * lu[rk + j]!;
    }
  }
  return -1;
}

/**
 * Solves A x = b from GEPP factors (PA = LU): x = U⁻¹ L⁻¹ P b.
 * Layout: lu packed n×n row-major as returned by luFactorPartialPivoting; b has length n and is
 * not mutated. Cost 2n² flops. Method: permutation, then the harness's trusted forward and back
 * substitutions (Golub & Van Loan, 4th ed., §3.1 and §3.4.5, from memory).
 */
export function luSolve(
  lu: ArrayLike<number>,
  perm: Int32Array,
  b: ArrayLike<number>,
  n: number,
): Float64Array {
  checkSquare(lu, n, 'lu');
  checkVector(b, n, 'b');
  checkPermutation(perm, n);
  const pb = new Float64Array(n);
  for (let i = 0; i < n; i++) pb[i] = b[perm[i]!]!;
  return solveUpper(lu, solveLowerUnit(lu, pb, n), n);
}

/**
 * Solves Aᵀ x = b from GEPP factors: Aᵀ = Uᵀ Lᵀ P, so x = Pᵀ L⁻ᵀ U⁻ᵀ b.
 * Layout as luSolve. Cost 2n² flops. Method: forward substitution with Uᵀ (read column-wise
 * from the upper part), the trusted back substitution with Lᵀ, then x[perm[i]] = z[i]
 * (Golub & Van Loan, 4th ed., §3.1, from memory; the transposed solve of LAPACK DGETRS).
 */
export function luSolveTransposed(
  lu: ArrayLike<number>,
  perm: Int32Array,
  b: ArrayLike<number>,
  n: number,
): Float64Array {
  checkSquare(lu, n, 'lu');
  checkVector(b, n, 'b');
  checkPermutation(perm, n);
  // Uᵀ w = b: row i of Uᵀ is column i of U, entries lu[j*n + i] for j ≤ i.
  const w = Float64Array.from(b);
  for (let i = 0; i < n; i++) {
    let s = w[i]!;
    for (let j = 0; j < i; j++) s -= lu[j * n + i]! * w[j]!;
    w[i] = s / lu[i * n + i]!;
  }
  const z = solveLowerUnitTransposed(lu, w, n);
  const x = new Float64Array(n);
  for (let i = 0; i < n; i++) x[perm[i]!] = z[i]!;
  return x;
}
