/**
 * Unit roundoff of IEEE 754 binary64 with round-to-nearest, u = 2^-53 (LAPACK DLAMCH('E');
 * Higham, ASNA 2nd ed., §2.1). Every test ratio divides by u, never by Number.EPSILON = 2^-52.
 */
export const UNIT_ROUNDOFF = 2 ** -53;

/** γ_k = k·u / (1 − k·u) (Higham, ASNA 2nd ed., §3.1); Infinity when k·u ≥ 1. */
export function gamma(k: number): number {
  const ku = k * UNIT_ROUNDOFF;
  return ku < 1 ? ku / (1 - ku) : Infinity;
}
