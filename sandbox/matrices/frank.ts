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
 * eigenvalues; κ₂(F₂₀) ≈ 3.2e19. In exact arithmetic LU without pivoting has the pivots n, then
 * (n+1−k)/(n+2−k) for k ≥ 2, all at least 1/2 (derived by elimination, checked in the tests); in
 * double the later pivots carry relative errors of order one already at n = 20, though they stay
 * far from zero. So both LU routines and back substitution are kept while the computed pivots
 * stay far from rounding noise (pivot-margins.ts), which covers n ≤ 512.
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
    const margins = n <= PIVOT_MARGIN_ORDER_LIMIT ? pivotMargins(data, n) : undefined;
    const safe = margins !== undefined && margins.partialPivoting >= SAFE_PIVOT_MARGIN;
    const noPivot = margins !== undefined && margins.noPivoting >= SAFE_PIVOT_MARGIN;
    return {
      data,
      properties: {
        positiveDefinite: false,
        singular: false,
        ...(facts?.condition1 !== undefined ? { exactCondition1: facts.condition1 } : {}),
        expectations: expectations({
          'lu-partial-pivoting': factorIf(safe),
          'lu-no-pivoting': factorIf(noPivot),
          'householder-qr': 'factor',
          'back-substitution': factorIf(safe),
        }),
        note: 'Frank matrix: det 1 yet κ explodes with n; "det close to 1" says nothing about accuracy.',
      },
    };
  },
};
