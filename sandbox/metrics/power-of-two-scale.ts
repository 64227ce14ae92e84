/**
 * A power of two σ that brings a matrix's largest entry near 1, so that the accurate residuals
 * neither overflow (Veltkamp's split fails above about 2^996) nor lose TwoProduct's error term
 * to underflow (below about 2^-969). Multiplying by a power of two is exact unless the result
 * underflows (IEEE 754-2019, §4.3; Higham, ASNA 2nd ed., §2.1, from memory), so every ratio
 * that is homogeneous in the scaled quantities is unchanged.
 */

/**
 * Returns σ = 2^k with σ·maxAbs in [0.5, 1), k clamped to [−limit, limit] (with the default
 * limit σ·maxAbs stays below 4 even for the largest double and above 2^-52 for the smallest
 * subnormal); returns 1 when maxAbs is 0, negative, NaN or infinite (nothing to scale).
 * Cost O(1). Method: exponent from Math.log2, corrected by exact comparisons with powers of two.
 */
export function powerOfTwoScale(maxAbs: number, limit = 1022): number {
  if (!Number.isInteger(limit) || limit < 0 || limit > 1022)
    throw new RangeError(`limit must be an integer in [0, 1022], got ${limit}`);
  if (!(maxAbs > 0) || maxAbs === Infinity) return 1;
  // Find e with 2^e ≤ maxAbs < 2^(e+1); log2 may be off by one next to a power of two.
  let e = Math.floor(Math.log2(maxAbs));
  while (2 ** e > maxAbs) e--;
  while (2 ** (e + 1) <= maxAbs) e++;
  const k = Math.min(limit, Math.max(-limit, -(e + 1)));
  return 2 ** k;
}
