/**
 * 1-norm condition estimation: κ₁(A) = ‖A‖₁·‖A⁻¹‖₁ with ‖A⁻¹‖₁ estimated from a few solves
 * with A and Aᵀ, never forming A⁻¹. Sources: W. W. Hager, "Condition estimates", SIAM J. Sci.
 * Stat. Comput. 5 (1984) 311–316; N. J. Higham, "FORTRAN codes for estimating the one-norm of a
 * real or complex matrix, with applications to condition estimation", ACM TOMS 14(4) (1988)
 * 381–396 (LAPACK DLACN2, formerly SONEST, and DGECON); Higham, ASNA 2nd ed., §15.3 (from memory).
 */
import { norm1 } from '@sandbox/numerics/norms.ts';
import { luFactorPartialPivoting, luSolve, luSolveTransposed } from '@sandbox/reference/gepp.ts';

/** DLACN2's iteration limit ITMAX. */
const MAX_ITERATIONS = 5;

function sum1(v: Float64Array): number {
  let s = 0;
  for (let i = 0; i < v.length; i++) s += Math.abs(v[i]!);
  return s;
}

/** ξ = sign(v) with sign(0) = +1, as DLACN2 (x ≥ 0 → +1). */
function signs(v: Float64Array): Float64Array {
  const xi = new Float64Array(v.length);
  for (let i = 0; i < v.length; i++) xi[i] = v[i]! >= 0 ? 1 : -1;
  return xi;
}

/** Index of the first entry of maximal |z_i| (LAPACK IDAMAX). */
function firstMaxAbs(z: Float64Array): number {
  let j = 0;
  let max = Math.abs(z[0]!);
  for (let i = 1; i < z.length; i++) {
    if (Math.abs(z[i]!) > max) {
      max = Math.abs(z[i]!);
      j = i;
    }
  }
  return j;
}

function unitVector(n: number, j: number): Float64Array {
  const e = new Float64Array(n);
  e[j] = 1;
  return e;
}

/**
 * Estimates ‖B‖₁ for an n×n matrix B seen only through products v ↦ Bv (`solve`) and
 * v ↦ Bᵀv (`solveTransposed`); for condition estimation B = A⁻¹ and both are solves.
 * Layout: vectors of length n; the callbacks must return new vectors. Cost at most 11 products
 * (usually 4–5). Method: Hager's 1-norm power method with Higham's refinements, step for step
 * as LAPACK DLACN2 (Higham 1988): start from x = (1/n, …, 1/n); alternate ξ = sign(Bx),
 * z = Bᵀξ, x = e_j with j the first maximal |z_j|; stop on a repeated sign vector, an estimate
 * that does not grow, or a repeated index; at most 5 iterations; finally try
 * x_i = (−1)^i (1 + i/(n−1)) and keep 2‖Bx‖₁/(3n) if larger. One deliberate difference: when
 * the estimate decreases, the previous (larger) value is kept rather than the latest.
 * The result is ‖Bx‖₁/‖x‖₁ for some x, so it never exceeds ‖B‖₁ (up to rounding in the
 * products); it can underestimate.
 */
export function inverseNorm1Estimate(
  solve: (v: Float64Array) => Float64Array,
  solveTransposed: (v: Float64Array) => Float64Array,
  n: number,
): number {
  if (!Number.isInteger(n) || n < 0)
    throw new RangeError(`n must be a non-negative integer, got ${n}`);
  if (n === 0) return 0;
  let v = solve(new Float64Array(n).fill(1 / n));
  if (n === 1) return Math.abs(v[0]!);
  let est = sum1(v);
  let xi = signs(v);
  let j = firstMaxAbs(solveTransposed(xi));
  for (let iteration = 2; ; iteration++) {
    v = solve(unitVector(n, j));
    const estOld = est;
    est = sum1(v);
    const xiNew = signs(v);
    // A repeated sign vector means convergence; an estimate that did not grow means cycling.
    if (xiNew.every((s, i) => s === xi[i])) break;
    if (est <= estOld) {
      // DLACN2 keeps the smaller, latest value here; both are lower bounds, so keep the larger.
      est = estOld;
      break;
    }
    xi = xiNew;
    const z = solveTransposed(xi);
    const jLast = j;
    j = firstMaxAbs(z);
    // DLACN2 compares the signed z(jlast) with |z(j)|.
    if (z[jLast] === Math.abs(z[j]!) || iteration >= MAX_ITERATIONS) break;
  }
  // Higham 1988's extra test vector guards against the power method's worst cases.
  const alt = new Float64Array(n);
  for (let i = 0; i < n; i++) alt[i] = (i % 2 === 0 ? 1 : -1) * (1 + i / (n - 1));
  const altEst = (2 * sum1(solve(alt))) / (3 * n);
  return altEst > est ? altEst : est;
}

/**
 * κ₁ estimate from existing GEPP factors (PA = LU) and the precomputed ‖A‖₁.
 * Layout: lu packed n×n row-major as from luFactorPartialPivoting. Cost about 10n² flops.
 * Method: ‖A‖₁ × inverseNorm1Estimate with B = A⁻¹ applied by luSolve / luSolveTransposed
 * (LAPACK DGECON's use of DLACN2; Higham 1988). Returns Infinity when the estimate is not
 * finite, 1 for n = 0 (as DGECON's RCOND = 1), and Infinity for ‖A‖₁ = 0.
 */
export function conditionEstimate1FromLu(
  lu: Float64Array,
  perm: Int32Array,
  n: number,
  aNorm1: number,
): number {
  if (n === 0) return 1;
  if (aNorm1 === 0) return Infinity;
  const inv = inverseNorm1Estimate(
    (v) => luSolve(lu, perm, v, n),
    (v) => luSolveTransposed(lu, perm, v, n),
    n,
  );
  const kappa = aNorm1 * inv;
  return Number.isFinite(kappa) ? kappa : Infinity;
}

/**
 * κ₁(A) = ‖A‖₁‖A⁻¹‖₁ estimate, a lower bound in exact arithmetic and usually within a small
 * factor of the truth. Layout: a is n×n row-major (a[i*n + j]), not mutated. Cost 2n³/3 flops
 * for GEPP plus about 10n² for the estimate. Method: GEPP, then conditionEstimate1FromLu
 * (LAPACK DGECON with DLACN2; Hager 1984; Higham 1988). Returns Infinity for a matrix on which
 * GEPP meets an exactly zero pivot.
 */
export function conditionEstimate1(a: ArrayLike<number>, n: number): number {
  const f = luFactorPartialPivoting(a, n);
  if (!f.ok) return Infinity;
  return conditionEstimate1FromLu(f.lu, f.perm, n, norm1(a, n, n));
}
