import type { FamilyDefinition } from '@sandbox/matrices/family-definition.ts';
import { spdProperties } from '@sandbox/matrices/spd-properties.ts';

/**
 * hilbert: h_ij = 1/(i + j − 1) (1-based), each entry rounded to the nearest double (Higham's Test
 * Matrix Toolbox hilb.m; references §4.1). H is SPD with κ growing like e^{3.5n}; the stored
 * fl(H) is a different matrix (κ₁(fl(H₁₃)) ≈ 3.9·κ₁(H₁₃), references §4.1), so κ₁ and
 * definiteness are those of fl(H), computed exactly when cheap. fl(H) is positive definite for
 * n ≤ 11 by Weyl's inequality, since ‖fl(H) − H‖₂ ≤ u·‖H‖_F < 1.3e-16 < λ_min(H₁₁) ≈ 3.4e-15
 * (references §4.1 table).
 */
export const hilbertFamily: FamilyDefinition = {
  seeded: false,
  rectangular: false,
  params: {},
  build({ n }) {
    const data = new Float64Array(n * n);
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) data[i * n + j] = 1 / (i + j + 1);
    return {
      data,
      properties: spdProperties(data, n, {
        note: 'Hilbert matrix, rounded to double: SPD, κ grows like e^{3.5n}; κ₁ is that of the stored matrix.',
        positiveDefinite: n <= 11,
      }),
    };
  },
};
