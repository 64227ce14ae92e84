/**
 * The Benjamini–Hochberg step-up procedure, which controls the false discovery rate at level q for
 * independent (or positively dependent) tests (Y. Benjamini & Y. Hochberg, "Controlling the false
 * discovery rate", JRSS B 57 (1995) 289–300, from memory).
 */

export interface BenjaminiHochbergResult {
  /** BH-adjusted p-values, in the order of the input: p̃_(i) = min_{j ≥ i} min(1, m·p_(j)/j). */
  adjusted: number[];
  /** Rejections at level q: exactly the tests with p_(i) ≤ i·q/m for some i at or above their rank. */
  rejected: boolean[];
}

/**
 * BH adjusted p-values and rejections at level q (default 0.05) for m p-values.
 * Method: sort ascending, p̃_(i) = m·p_(i)/i, then running minimum from the largest p downwards,
 * capped at 1; reject H_(i) when p̃_(i) ≤ q, which is the step-up rule "reject H_(1..k), k the
 * largest i with p_(i) ≤ i·q/m". Cost O(m log m). An empty input gives empty results.
 * Throws RangeError when a p-value is outside [0, 1] (or NaN) or q is outside (0, 1].
 */
export function benjaminiHochberg(pValues: readonly number[], q = 0.05): BenjaminiHochbergResult {
  if (!(q > 0 && q <= 1)) throw new RangeError(`q must lie in (0, 1], got ${q}`);
  const m = pValues.length;
  pValues.forEach((p, i) => {
    if (!(p >= 0 && p <= 1)) throw new RangeError(`pValues[${i}] must lie in [0, 1], got ${p}`);
  });
  const order = Array.from({ length: m }, (_, i) => i).sort((a, b) => pValues[a]! - pValues[b]!);
  const adjusted = new Array<number>(m).fill(1);
  let running = 1;
  for (let rank = m; rank >= 1; rank--) {
    const index = order[rank - 1]!;
    running = Math.min(running, (m * pValues[index]!) / rank);
    adjusted[index] = running;
  }
  return { adjusted, rejected: adjusted.map((p) => p <= q) };
}
