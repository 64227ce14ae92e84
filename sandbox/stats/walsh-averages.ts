/**
 * Walsh averages (x_i + x_j)/2 for i ≤ j of a sample of size n: n(n+1)/2 values whose median is the
 * one-sample Hodges–Lehmann estimate and whose order statistics bound its signed-rank confidence
 * interval (J. E. Walsh, 1949; Hollander, Wolfe & Chicken, 3rd ed., 2014, §3.2–3.3, from memory).
 */

/**
 * All Walsh averages of `x`, sorted ascending. Layout: a Float64Array of length n(n+1)/2.
 * Cost O(n² log n) (n² values, one sort). Throws RangeError when an entry is not finite.
 */
export function walshAverages(x: ArrayLike<number>): Float64Array {
  const n = x.length;
  for (let i = 0; i < n; i++) {
    if (!Number.isFinite(x[i]!)) throw new RangeError(`x[${i}] must be finite, got ${x[i]}`);
  }
  const out = new Float64Array((n * (n + 1)) / 2);
  let k = 0;
  for (let i = 0; i < n; i++) {
    for (let j = i; j < n; j++) out[k++] = (x[i]! + x[j]!) / 2;
  }
  return out.sort();
}
