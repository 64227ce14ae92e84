import { factorableGeneralProperties } from '@sandbox/matrices/factorable-general-properties.ts';
import type { FamilyDefinition } from '@sandbox/matrices/family-definition.ts';

/**
 * worst-growth: ones on the diagonal and in the last column, −α strictly below the diagonal (the
 * GFPP matrix; N. J. Higham & D. J. Higham, SIAM J. Matrix Anal. Appl. 10 (1989) 155–164; Higham,
 * ASNA §9.4, from memory; references §3). GEPP keeps the diagonal pivots 1 and U = I except its
 * last column (1, 1+α, …, (1+α)^{n−1}), all computed without rounding for α = 1 and for α = 0.5
 * up to n = 34, so the growth factor is (1+α)^{n−1}: 2^{n−1} for α = 1 when ties pick the first
 * maximum (a `>=` scan picks the last row and sees growth 2), 1.5^{n−1} for α = 0.5 under any tie
 * rule. κ₁ = n for α = 1 (references §3, fact 3), yet GEPP's solution is all wrong for n ≥ 55.
 */
export const worstGrowthFamily: FamilyDefinition = {
  seeded: false,
  rectangular: false,
  params: {
    alpha: {
      default: 1,
      check: (v) => (v > 0 && v <= 1 ? undefined : 'alpha must be in (0, 1]'),
    },
  },
  check: ({ n, params }) =>
    (n - 1) * Math.log2(1 + params.alpha!) > 1000
      ? 'worst-growth needs (1 + alpha)^(n−1) ≤ 2^1000 (the last column of U overflows beyond)'
      : undefined,
  build({ n, params }) {
    const alpha = params.alpha!;
    const data = new Float64Array(n * n);
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < i; j++) data[i * n + j] = -alpha;
      data[i * n + i] = 1;
      data[i * n + n - 1] = 1;
    }
    return {
      data,
      properties: factorableGeneralProperties(
        data,
        n,
        alpha === 1
          ? 'Worst-case GEPP growth 2^(n−1) with first-maximum ties (2 with last-maximum); κ₁ = n.'
          : `Worst-growth variant α = ${alpha}: GEPP growth (1+α)^(n−1) under any tie rule.`,
      ),
    };
  },
};
