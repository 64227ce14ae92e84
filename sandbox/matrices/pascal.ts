import type { FamilyDefinition } from '@sandbox/matrices/family-definition.ts';
import { spdProperties } from '@sandbox/matrices/spd-properties.ts';

/** Largest order whose Pascal entries, up to C(2n−2, n−1) = C(56, 28) ≈ 7.65e15, are all below 2^53. */
export const PASCAL_EXACT_ORDER = 29;

/**
 * pascal: p_ij = C(i+j−2, i−1) (1-based), built by p_ij = p_{i−1,j} + p_{i,j−1} (Pascal's rule),
 * so entries are exact integers for n ≤ 29 and correctly rounded sums beyond (Higham's Test Matrix
 * Toolbox pascal.m; references §4.2). P is SPD with det 1 and an integer inverse; its Cholesky
 * factor is the lower-triangular Pascal matrix C(i−1, j−1), which Cholesky in double reproduces
 * bit for bit for n ≤ 29 because every intermediate is an integer below 2^53 (references §4.2,
 * computed), and likewise LDLᵀ (D = I) and LU without pivoting (U = Lᵀ). n ≤ 512 keeps
 * C(2n−2, n−1) finite.
 */
export const pascalFamily: FamilyDefinition = {
  seeded: false,
  rectangular: false,
  params: {},
  check: ({ n }) => (n > 512 ? 'pascal needs n ≤ 512 (larger entries overflow)' : undefined),
  build({ n }) {
    const data = new Float64Array(n * n);
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < n; j++) {
        data[i * n + j] = i === 0 || j === 0 ? 1 : data[(i - 1) * n + j]! + data[i * n + j - 1]!;
      }
    }
    const exact = n <= PASCAL_EXACT_ORDER;
    return {
      data,
      properties: spdProperties(data, n, {
        note: exact
          ? 'Pascal matrix: SPD, det 1, integer inverse; Cholesky, LDLᵀ and no-pivot LU are exact.'
          : 'Pascal matrix beyond n = 29: entries rounded, κ astronomically large.',
        positiveDefinite: exact,
        exactFactors: exact,
      }),
    };
  },
};
