/**
 * All pairwise differences x_i − y_j, sorted ascending: the two-sample analogue of the Walsh
 * averages, whose median is the Hodges–Lehmann shift estimate and whose order statistics bound its
 * Mann–Whitney confidence interval (Hodges & Lehmann, Ann. Math. Statist. 34 (1963) 598–611;
 * Lehmann, Nonparametrics, 1975, §2.6, from memory). Layout: Float64Array of length m·n.
 * Cost O(mn log(mn)). Throws RangeError when an entry is not finite.
 */
export function pairwiseDifferences(x: ArrayLike<number>, y: ArrayLike<number>): Float64Array {
  for (let i = 0; i < x.length; i++) {
    if (!Number.isFinite(x[i]!)) throw new RangeError(`x[${i}] must be finite, got ${x[i]}`);
  }
  for (let j = 0; j < y.length; j++) {
    if (!Number.isFinite(y[j]!)) throw new RangeError(`y[${j}] must be finite, got ${y[j]}`);
  }
  const out = new Float64Array(x.length * y.length);
  let k = 0;
  for (let i = 0; i < x.length; i++) {
    for (let j = 0; j < y.length; j++) out[k++] = x[i]! - y[j]!;
  }
  return out.sort();
}
