import type { FamilyDefinition } from '@sandbox/matrices/family-definition.ts';
import { spdProperties } from '@sandbox/matrices/spd-properties.ts';
import { uniformEntries } from '@sandbox/matrices/uniform.ts';
import { norm1 } from '@sandbox/numerics/norms.ts';

/**
 * spd-random: A = B·Bᵀ + n·I with B uniform on [−1, 1) (row by row from the seeded stream). Each
 * entry of B·Bᵀ is one dot product summed in index order and mirrored, so A is exactly symmetric.
 * λ_min(A) ≥ n less the rounding of B·Bᵀ (at most n³·u in norm; Higham, ASNA 2nd ed., §3.5), so
 * A is positive definite and κ₁(A) ≤ ‖A‖₁·√n·‖A⁻¹‖₂ ≤ ‖A‖₁/√n (with 1 % room for that rounding).
 * Cost n³ flops.
 */
export const spdRandomFamily: FamilyDefinition = {
  seeded: true,
  rectangular: false,
  params: {},
  build({ n, random }) {
    const b = uniformEntries(random, n * n);
    const data = new Float64Array(n * n);
    for (let i = 0; i < n; i++) {
      for (let j = 0; j <= i; j++) {
        let s = 0;
        for (let k = 0; k < n; k++) s += b[i * n + k]! * b[j * n + k]!;
        data[i * n + j] = s;
        data[j * n + i] = s;
      }
      data[i * n + i]! += n;
    }
    return {
      data,
      properties: spdProperties(data, n, {
        note: 'Random symmetric positive definite B·Bᵀ + n·I: well conditioned, for Cholesky and LDLᵀ.',
        positiveDefinite: true,
        condition1Bound: (1.01 * norm1(data, n, n)) / Math.sqrt(n),
      }),
    };
  },
};
