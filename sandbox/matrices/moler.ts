import type { FamilyDefinition } from '@sandbox/matrices/family-definition.ts';
import { spdProperties } from '@sandbox/matrices/spd-properties.ts';

/**
 * moler: A = UᵀU with U unit upper triangular, α above the diagonal (Higham's Test Matrix Toolbox
 * moler.m, TRIW(n, α); J. C. Nash, Compact Numerical Methods for Computers, 2nd ed., 1990, App. 1;
 * references §4.4). Entrywise (1-based, i ≤ j): a_ij = (i−1)α² + α for i < j and a_ii = (i−1)α² + 1;
 * for α = −1 that is a_ii = i, a_ij = min(i, j) − 2. det A = 1, one tiny eigenvalue (κ₂ = 3.7e6 at
 * n = 10, references §4.4). When α is an integer and n·α² stays below 2^53 every entry and every
 * intermediate of Cholesky (factor Uᵀ), LDLᵀ (D = I) and LU without pivoting is an exact integer.
 */
export const molerFamily: FamilyDefinition = {
  seeded: false,
  rectangular: false,
  params: {
    alpha: {
      default: -1,
      check: (v) => (Math.abs(v) <= 1e6 ? undefined : 'alpha must be from −1e6 to 1e6'),
    },
  },
  build({ n, params }) {
    const alpha = params.alpha!;
    const data = new Float64Array(n * n);
    for (let i = 0; i < n; i++) {
      for (let j = i; j < n; j++) {
        const v = i * alpha * alpha + (i === j ? 1 : alpha);
        data[i * n + j] = v;
        data[j * n + i] = v;
      }
    }
    const exact = Number.isInteger(alpha) && n * (alpha * alpha + 1) <= 2 ** 53;
    return {
      data,
      properties: spdProperties(data, n, {
        note: `Moler matrix (α = ${alpha}): SPD with one tiny eigenvalue; Cholesky factor unit lower with α below.`,
        positiveDefinite: exact,
        exactFactors: exact,
      }),
    };
  },
};
