import type { FamilyDefinition } from '@sandbox/matrices/family-definition.ts';
import { spdProperties } from '@sandbox/matrices/spd-properties.ts';

/**
 * poisson-2d: the 5-point Laplacian on a k×k grid, n = k², in row-by-row (natural) ordering:
 * A = I ⊗ T_k + T_k ⊗ I with 4 on the diagonal and −1 for each grid neighbour (J. W. Demmel,
 * Applied Numerical Linear Algebra, 1997, §6.3, from memory). Its eigenvalues are λ_i + λ_j with
 * λ the eigenvalues of T_k (references §4.8), so A is SPD with κ₂ = cot²(π/(2k+2)) and
 * κ₁ ≤ n·κ₂.
 */
export const poisson2dFamily: FamilyDefinition = {
  seeded: false,
  rectangular: false,
  params: {},
  check: ({ n }) =>
    Number.isInteger(Math.sqrt(n))
      ? undefined
      : `poisson-2d needs n = k² (a perfect square), got ${n}`,
  build({ n }) {
    const k = Math.sqrt(n);
    const data = new Float64Array(n * n);
    for (let r = 0; r < k; r++) {
      for (let c = 0; c < k; c++) {
        const p = r * k + c;
        data[p * n + p] = 4;
        if (c > 0) data[p * n + p - 1] = -1;
        if (c < k - 1) data[p * n + p + 1] = -1;
        if (r > 0) data[p * n + p - k] = -1;
        if (r < k - 1) data[p * n + p + k] = -1;
      }
    }
    const cot = 1 / Math.tan(Math.PI / (2 * k + 2));
    return {
      data,
      properties: spdProperties(data, n, {
        note: `2-D Poisson matrix on a ${k}×${k} grid (5-point): SPD, banded, κ₂ = cot²(π/(2k+2)).`,
        positiveDefinite: true,
        condition1Bound: 1.01 * n * cot * cot,
      }),
    };
  },
};
