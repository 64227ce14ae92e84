import { exactFacts } from '@sandbox/matrices/exact-analysis.ts';
import { expectations, factorIf } from '@sandbox/matrices/expectation-rules.ts';
import type { FamilyDefinition } from '@sandbox/matrices/family-definition.ts';
import {
  PIVOT_MARGIN_ORDER_LIMIT,
  SAFE_PIVOT_MARGIN,
  pivotMargins,
} from '@sandbox/matrices/pivot-margins.ts';

/**
 * frank: upper Hessenberg, f_ij = n + 1 − j for i ≤ j, f_{j+1,j} = n − j (1-based), else 0
 * (Higham's Test Matrix Toolbox frank.m; references §4.6). Integer entries, det 1, ill-conditioned
 * eigenvalues; κ₂(F₂₀) ≈ 3.2e19. LU without pivoting has the pivots n, then (n+1−k)/(n+2−k) for
 * k ≥ 2 — all at least 1/2 — so it never meets a tiny pivot (derived by elimination, checked in the
 * tests); partial pivoting and back substitution are kept while GEPP's pivots stay far from
 * rounding noise (pivot-margins.ts).
 */
export const frankFamily: FamilyDefinition = {
  seeded: false,
  rectangular: false,
  params: {},
  build({ n }) {
    const data = new Float64Array(n * n);
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < n; j++) {
        if (i <= j) data[i * n + j] = n - j;
        else if (i === j + 1) data[i * n + j] = n - j - 1;
      }
    }
    const facts = exactFacts(data, n);
    const safe =
      n <= PIVOT_MARGIN_ORDER_LIMIT && pivotMargins(data, n).partialPivoting >= SAFE_PIVOT_MARGIN;
    return {
      data,
      properties: {
        positiveDefinite: false,
        singular: false,
        ...(facts?.condition1 !== undefined ? { exactCondition1: facts.condition1 } : {}),
        expectations: expectations({
          'lu-partial-pivoting': factorIf(safe),
          'lu-no-pivoting': 'factor',
          'householder-qr': 'factor',
          'back-substitution': factorIf(safe),
        }),
        note: 'Frank matrix: det 1 yet κ explodes with n; "det close to 1" says nothing about accuracy.',
      },
    };
  },
};
