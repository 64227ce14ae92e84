import type { FamilyDefinition } from '@sandbox/matrices/family-definition.ts';
import { spdProperties } from '@sandbox/matrices/spd-properties.ts';

/** The second-difference matrix T_n = tridiag(−1, 2, −1), row-major n×n. */
export function secondDifference(n: number, shift = 0): Float64Array {
  const data = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    data[i * n + i] = 2 - shift;
    if (i > 0) data[i * n + i - 1] = -1;
    if (i < n - 1) data[i * n + i + 1] = -1;
  }
  return data;
}

/**
 * κ₁(T_n) in closed form: ‖T⁻¹‖₁ = max_j j(n+1−j)/2 from (T⁻¹)_ij = min(i,j)(n+1−max(i,j))/(n+1)
 * (Burkardt's dif2.py, citing Gregory & Karney, Ex. 3.18; references §4.8), times ‖T‖₁ = 2, 3, 4
 * for n = 1, 2, ≥ 3. Exact in double (a multiple of 1/2 below 2^53).
 */
export function secondDifferenceCondition1(n: number): number {
  const j = Math.floor((n + 1) / 2);
  const inverseNorm = (j * (n + 1 - j)) / 2;
  return (n === 1 ? 2 : n === 2 ? 3 : 4) * inverseNorm;
}

/**
 * poisson-1d: T_n = tridiag(−1, 2, −1), the 1-D Poisson (second-difference) matrix (references
 * §4.8). SPD M-matrix with eigenvalues 2 − 2cos(kπ/(n+1)), κ₂ = cot²(π/(2n+2)), det n + 1; LU
 * without pivoting has pivots (i+1)/i.
 */
export const poisson1dFamily: FamilyDefinition = {
  seeded: false,
  rectangular: false,
  params: {},
  build({ n }) {
    const data = secondDifference(n);
    return {
      data,
      properties: spdProperties(data, n, {
        note: '1-D Poisson matrix tridiag(−1, 2, −1): SPD, κ ~ n², eigenvalues 2 − 2cos(kπ/(n+1)).',
        positiveDefinite: true,
        condition1: secondDifferenceCondition1(n),
      }),
    };
  },
};
