import type { FamilyDefinition } from '@sandbox/matrices/family-definition.ts';
import { spdProperties } from '@sandbox/matrices/spd-properties.ts';

/**
 * lehmer: a_ij = min(i, j)/max(i, j) (1-based), each entry rounded to double (Higham's Test Matrix
 * Toolbox lehmer.m; references §4.5). A is SPD with n ≤ κ₂ ≤ 4n² (Newman & Todd 1958, as cited
 * in references §4.5), so κ₁ ≤ n·κ₂ ≤ 4n³. The rounding (‖ΔA‖₂ ≤ u·n) stays far below
 * λ_min ≥ 1/(4n²) for every allowed n, so the stored matrix is positive definite too (Weyl).
 */
export const lehmerFamily: FamilyDefinition = {
  seeded: false,
  rectangular: false,
  params: {},
  build({ n }) {
    const data = new Float64Array(n * n);
    for (let i = 0; i < n; i++)
      for (let j = 0; j < n; j++) data[i * n + j] = (Math.min(i, j) + 1) / (Math.max(i, j) + 1);
    return {
      data,
      properties: spdProperties(data, n, {
        note: 'Lehmer matrix: SPD, totally nonnegative, well conditioned (κ₂ ≤ 4n²), tridiagonal inverse.',
        positiveDefinite: true,
        condition1Bound: 4 * n ** 3,
      }),
    };
  },
};
