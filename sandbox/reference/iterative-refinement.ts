/**
 * Iterative refinement of a solution of A x = b with residuals computed in twice the working
 * precision (Dot2) and a caller-supplied correction solver. Dense row-major n×n storage: entry
 * (i, j) of A is a[i*n + j].
 */
import { residualAccurateDoubleDouble } from '@sandbox/numerics/accurate-residual.ts';
import { vectorNormInf } from '@sandbox/numerics/norms.ts';
import { UNIT_ROUNDOFF } from '@sandbox/numerics/unit-roundoff.ts';

/** Upper limit on refinement steps (cf. LAPACK DGERFS's ITMAX = 5; we allow more). */
export const MAX_REFINEMENT_STEPS = 10;

/** What refinement produced: the last iterate, the corrections applied, and whether it settled. */
export interface RefinementOutcome {
  x: Float64Array;
  /** Number of corrections applied to the starting vector. */
  steps: number;
  /** True when the last correction was at the rounding level of x (see refineSolution). */
  converged: boolean;
  /** ‖d‖∞ of the last correction computed (applied or not); NaN if none was computed. */
  lastCorrection: number;
}

/**
 * Refines x0 by x ← x + d with d = solveCorrection(r), r = b − A x in double-double.
 * Layout: a is n×n row-major (a[i*n + j]); b, x0 length n; nothing is mutated. Cost per step
 * about 25n² flops for the residual plus one correction solve.
 * Method: classical refinement with extra-precise residuals (Higham, ASNA 2nd ed., ch. 12,
 * Thm 12.1; J. H. Wilkinson, Rounding Errors in Algebraic Processes, 1963; both from memory).
 * Stopping rule, per step with d the new correction: converged when ‖d‖∞ ≤ u‖x‖∞ or when
 * fl(x + d) = x in every component (the correction is below the rounding level of x); stop
 * unconverged, without applying d, when ‖d‖∞ has not at least halved since the previous step
 * (as LAPACK DGERFS's "at least halved" test), when d is not finite, or after maxSteps steps.
 */
export function refineSolution(
  a: ArrayLike<number>,
  n: number,
  b: ArrayLike<number>,
  x0: ArrayLike<number>,
  solveCorrection: (rHi: Float64Array, rLo: Float64Array) => Float64Array,
  maxSteps: number = MAX_REFINEMENT_STEPS,
): RefinementOutcome {
  if (!Number.isInteger(maxSteps) || maxSteps < 0)
    throw new RangeError(`maxSteps must be a non-negative integer, got ${maxSteps}`);
  let x = Float64Array.from(x0);
  let previous = Infinity;
  let last = NaN;
  for (let step = 1; step <= maxSteps; step++) {
    const r = residualAccurateDoubleDouble(a, n, n, x, b);
    const d = solveCorrection(r.hi, r.lo);
    const dNorm = vectorNormInf(d);
    last = dNorm;
    if (!Number.isFinite(dNorm) || dNorm > previous / 2)
      return { x, steps: step - 1, converged: false, lastCorrection: last };
    const next = new Float64Array(n);
    let unchanged = true;
    for (let i = 0; i < n; i++) {
      next[i] = x[i]! + d[i]!;
      if (next[i] !== x[i]) unchanged = false;
    }
    const atRoundingLevel = unchanged || dNorm <= UNIT_ROUNDOFF * vectorNormInf(x);
    x = next;
    if (atRoundingLevel) return { x, steps: step, converged: true, lastCorrection: last };
    previous = dNorm;
  }
  return { x, steps: maxSteps, converged: false, lastCorrection: last };
}
