/**
 * Ratios under the conventions every metric shares: 0/0 := 0 and (nonzero)/0 := ∞ (the
 * Oettli–Prager convention, Higham, ASNA 2nd ed., §7.2, from memory), and a value that cannot
 * be computed (NaN from non-finite data) is reported as ∞, the worst score, never as NaN.
 */

/** v, or Infinity when v is NaN. Cost O(1). */
export function worstIfNaN(v: number): number {
  return Number.isNaN(v) ? Infinity : v;
}

/**
 * num / den for non-negative num and den with 0/0 := 0, x/0 := ∞ for x > 0, and NaN (from a NaN
 * operand or ∞/∞) := ∞. Cost O(1).
 */
export function ratioOrWorst(num: number, den: number): number {
  if (Number.isNaN(num) || Number.isNaN(den)) return Infinity;
  if (num === 0) return 0;
  if (den === 0) return Infinity;
  return worstIfNaN(num / den);
}
