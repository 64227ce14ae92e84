import { expectations } from '@sandbox/matrices/expectation-rules.ts';
import type { FamilyDefinition } from '@sandbox/matrices/family-definition.ts';

/**
 * singular: row 1 = (1, 2, …, n), row n = 2·row 1, and rows 2..n−1 = 2n on the diagonal and 1 in
 * columns 2..n off it (0 in column 1); n = 2 gives [[1, 2], [2, 4]] (references §4.11). Exactly
 * singular, and every elimination meets an exact zero pivot in floating point: GEPP picks row n
 * first (its 2 is the unique column maximum) and row 1 − 0.5·row n is exactly zero, because
 * 0.5·2j = j with no rounding; LU without pivoting makes row n − 2·row 1 exactly zero. A zero
 * row only ever gets multipliers 0, so it stays zero and the last pivot is exactly 0, under any
 * tie rule and any classical operation order. Rows 2..n−1 form a strictly diagonally dominant
 * block, so no other pivot comes near zero. Back substitution gets GEPP's U, with U_nn = 0.
 */
export const singularFamily: FamilyDefinition = {
  seeded: false,
  rectangular: false,
  params: {},
  check: ({ n }) => (n < 2 ? 'singular needs n ≥ 2' : undefined),
  build({ n }) {
    const data = new Float64Array(n * n);
    for (let j = 0; j < n; j++) {
      data[j] = j + 1;
      data[(n - 1) * n + j] = 2 * (j + 1);
    }
    for (let i = 1; i < n - 1; i++)
      for (let j = 1; j < n; j++) data[i * n + j] = i === j ? 2 * n : 1;
    return {
      data,
      properties: {
        positiveDefinite: false,
        singular: true,
        expectations: expectations({
          'lu-partial-pivoting': 'reject',
          'lu-no-pivoting': 'reject',
          'householder-qr': 'factor',
          'back-substitution': 'reject',
        }),
        note: 'Exactly singular (last row = 2 × first): every LU meets an exactly zero pivot and must reject.',
      },
    };
  },
};
