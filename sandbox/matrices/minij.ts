import type { FamilyDefinition } from '@sandbox/matrices/family-definition.ts';
import { spdProperties } from '@sandbox/matrices/spd-properties.ts';

/**
 * κ₁ of minij(n) in closed form: ‖A‖₁ = n(n+1)/2 (the last column) and A⁻¹ = tridiag(−1, 2, −1)
 * with 1 at (n, n) (references §4.3), whose largest column sum is 1, 3 or 4 for n = 1, 2, ≥ 3.
 */
export function minijCondition1(n: number): number {
  const inverseNorm = n === 1 ? 1 : n === 2 ? 3 : 4;
  return ((n * (n + 1)) / 2) * inverseNorm;
}

/**
 * minij: a_ij = min(i, j) (1-based), exact integers (Higham's Test Matrix Toolbox minij.m;
 * references §4.3). SPD, det 1, Cholesky factor the lower triangle of ones; Cholesky, LDLᵀ (D = I)
 * and LU without pivoting involve only small integers, so they are exact in double.
 */
export const minijFamily: FamilyDefinition = {
  seeded: false,
  rectangular: false,
  params: {},
  build({ n }) {
    const data = new Float64Array(n * n);
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) data[i * n + j] = Math.min(i, j) + 1;
    return {
      data,
      properties: spdProperties(data, n, {
        note: 'min(i, j): SPD, det 1, Cholesky factor all ones, tridiagonal inverse; κ₁ in closed form.',
        positiveDefinite: true,
        condition1: minijCondition1(n),
        exactFactors: true,
      }),
    };
  },
};
