/**
 * Forward error of a computed solution against the reference solver's solution, and how it
 * compares with what a backward stable method can promise.
 */
import { vectorNormInf } from '@sandbox/numerics/norms.ts';
import { UNIT_ROUNDOFF } from '@sandbox/numerics/unit-roundoff.ts';
import { checkLength } from './argument-checks.ts';
import { powerOfTwoScale } from './power-of-two-scale.ts';
import { ratioOrWorst, worstIfNaN } from './safe-ratio.ts';

/**
 * ‖x̂ − x_ref‖∞ / ‖x_ref‖∞ (Higham, ASNA 2nd ed., §1.2 relative error, from memory), with 0/0 := 0
 * and (nonzero)/0 := ∞. Both vectors are scaled by one power of two from max|x_ref| so that the
 * differences do not overflow; NaN gives ∞. Cost 2n.
 */
export function forwardError(x: ArrayLike<number>, xRef: ArrayLike<number>): number {
  checkLength('x', x, xRef.length);
  const sigma = powerOfTwoScale(vectorNormInf(xRef));
  let num = 0;
  for (let i = 0; i < x.length; i++) {
    const v = Math.abs(sigma * x[i]! - sigma * xRef[i]!);
    if (v > num || Number.isNaN(v)) num = v;
  }
  return ratioOrWorst(num, sigma * vectorNormInf(xRef));
}

/**
 * forwardError / (κ∞(A)·u): near or below 1 is what a backward stable solver delivers, since
 * forward error ≲ condition number × backward error (Higham, ASNA 2nd ed., §1.5 and §7.1; a rule
 * of thumb). `condition` is κ∞(A) (exact where known, else an estimate); it must be positive
 * (Infinity allowed: a finite error then scores 0). ∞/∞ and NaN give ∞.
 */
export function forwardErrorOverBound(forwardErrorValue: number, condition: number): number {
  if (Number.isNaN(condition) || !(condition > 0))
    throw new RangeError(`condition must be a positive number, got ${condition}`);
  if (Number.isNaN(forwardErrorValue)) return Infinity;
  if (forwardErrorValue === 0) return 0;
  return worstIfNaN(forwardErrorValue / (condition * UNIT_ROUNDOFF));
}
