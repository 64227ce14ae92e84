/**
 * The engine's reference solver for A x = b: the x_ref against which forward errors are
 * measured, with a flag saying whether it can be trusted. Dense row-major n×n storage: entry
 * (i, j) of A is a[i*n + j]. See numerics.md, "Reference solver".
 */
import { norm1 } from '@sandbox/numerics/norms.ts';
import { UNIT_ROUNDOFF } from '@sandbox/numerics/unit-roundoff.ts';
import { conditionEstimate1FromLu } from '@sandbox/reference/condition-estimate.ts';
import { luFactorPartialPivoting, luSolve } from '@sandbox/reference/gepp.ts';
import { refineSolution } from '@sandbox/reference/iterative-refinement.ts';
import { luFactorDoubleDouble, luSolveDoubleDouble } from '@sandbox/reference/lu-double-double.ts';

/**
 * Condition estimates at or above this are "κ·u ≳ 1" and make the reference untrusted:
 * 1/(16u) = 2^49 ≈ 5.6e14. A margin of an order of magnitude below κu = 1 (common practice).
 */
export const TRUSTED_CONDITION_LIMIT = 1 / (16 * UNIT_ROUNDOFF);

/** The reference solution and how far to believe it. */
export interface ReferenceSolution {
  x: Float64Array;
  /** False when κ₁ estimate ≥ TRUSTED_CONDITION_LIMIT, the matrix is singular in double, or
   *  refinement did not converge; forward-error metrics are then marked untrustworthy. */
  trusted: boolean;
  /** Refinement corrections applied (by the method that produced x). */
  steps: number;
  method: 'gepp+refinement' | 'double-double-lu';
  /** κ₁ estimate from the double GEPP factors (Infinity if GEPP met a zero pivot). */
  conditionEstimate: number;
  /** Why the solution is not trusted; absent when trusted. */
  reason?: string;
}

function checkArguments(a: ArrayLike<number>, n: number, b: ArrayLike<number>): void {
  if (!Number.isInteger(n) || n < 0)
    throw new RangeError(`n must be a non-negative integer, got ${n}`);
  if (a.length !== n * n)
    throw new RangeError(`a must hold n*n = ${n * n} entries, has ${a.length}`);
  if (b.length !== n) throw new RangeError(`b must have length n = ${n}, has ${b.length}`);
  for (let k = 0; k < a.length; k++)
    if (!Number.isFinite(a[k]!)) throw new RangeError(`a must be finite; a[${k}] = ${a[k]}`);
  for (let k = 0; k < n; k++)
    if (!Number.isFinite(b[k]!)) throw new RangeError(`b must be finite; b[${k}] = ${b[k]}`);
}

function untrustedReason(converged: boolean, kappa: number, zeroPivot: number): string | null {
  if (zeroPivot >= 0) return `GEPP in double met an exactly zero pivot in column ${zeroPivot}`;
  if (!converged) return 'refinement did not converge, even with double-double factors';
  if (!(kappa < TRUSTED_CONDITION_LIMIT))
    return `condition estimate ${kappa.toPrecision(3)} is at least 1/(16u) ≈ 5.6e14`;
  return null;
}

function solution(
  x: Float64Array,
  steps: number,
  method: ReferenceSolution['method'],
  conditionEstimate: number,
  reason: string | null,
): ReferenceSolution {
  const base = { x, steps, method, conditionEstimate };
  return reason === null ? { ...base, trusted: true } : { ...base, trusted: false, reason };
}

/**
 * Solves A x = b for the reference value x_ref.
 * Layout: a is n×n row-major (a[i*n + j]), b length n; inputs must be finite and are not
 * mutated. Cost 2n³/3 flops for GEPP, about 10n² for the condition estimate, about 27n² per
 * refinement step; in the fallback, 2n³/3 double-double operations more.
 * Method: GEPP in double (first-maximum pivot), then iterative refinement with double-double
 * residuals (at most 10 steps; stop when the correction no longer halves or is at the rounding
 * level of x; cf. LAPACK DGERFS; Higham, ASNA 2nd ed., ch. 12, from memory). If that does not
 * converge, or GEPP meets an exactly zero pivot, GEPP in double-double arithmetic, then the
 * same refinement with corrections solved in double-double from the double-double residual.
 * Trusted when it converged and the κ₁ estimate (Hager 1984; Higham 1988) is below 1/(16u)
 * (common practice).
 * A singular matrix (zero pivot even in double-double) gives x of NaN and trusted = false.
 */
export function referenceSolve(
  a: ArrayLike<number>,
  n: number,
  b: ArrayLike<number>,
): ReferenceSolution {
  checkArguments(a, n, b);
  if (n === 0) return solution(new Float64Array(0), 0, 'gepp+refinement', 1, null);
  let kappa: number;
  let zeroPivot = -1;
  const f = luFactorPartialPivoting(a, n);
  if (f.ok) {
    kappa = conditionEstimate1FromLu(f.lu, f.perm, n, norm1(a, n, n));
    const x0 = luSolve(f.lu, f.perm, b, n);
    const out = refineSolution(a, n, b, x0, (rHi) => luSolve(f.lu, f.perm, rHi, n));
    if (out.converged)
      return solution(out.x, out.steps, 'gepp+refinement', kappa, untrustedReason(true, kappa, -1));
  } else {
    kappa = Infinity;
    zeroPivot = f.column;
  }
  const g = luFactorDoubleDouble(a, n);
  if (!g.ok) {
    const x = new Float64Array(n).fill(NaN);
    const reason = `singular: exactly zero pivot in column ${g.column} even in double-double`;
    return solution(x, 0, 'double-double-lu', Infinity, reason);
  }
  const x0 = luSolveDoubleDouble(g, b, new Float64Array(n), n).hi;
  const out = refineSolution(a, n, b, x0, (rHi, rLo) => luSolveDoubleDouble(g, rHi, rLo, n).hi);
  const reason = untrustedReason(out.converged, kappa, zeroPivot);
  return solution(out.x, out.steps, 'double-double-lu', kappa, reason);
}
