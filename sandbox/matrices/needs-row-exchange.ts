import { exactFacts } from '@sandbox/matrices/exact-analysis.ts';
import { clearlyNonsingular, expectations, factorIf } from '@sandbox/matrices/expectation-rules.ts';
import type { FamilyDefinition } from '@sandbox/matrices/family-definition.ts';

const TINY = 2 ** -20;

/**
 * needs-row-exchange: a_11 = pivot, a_12 = a_21 = 1, the trailing (n−1)×(n−1) block minij(n−1),
 * zeros elsewhere; symmetric, and for n = 2 with the default pivot exactly [[1e-20, 1], [1, 1]]
 * (references §4.12). LU without pivoting takes the tiny pivot: U₂₂ = fl(1 − 1e20) = −1e20, factor
 * ratio 2⁵¹ at n = 2, while GEPP swaps rows 1 and 2 and is accurate. Row 1 is zero beyond column 2,
 * so the damage stays in the leading 2×2 block: the later pivots are those of its Schur
 * complement minij(n−2) + 11ᵀ/(1 − pivot), which is SPD, far from zero. pivot = 0 gives a zero first pivot; pivot = 1
 * (n ≥ 3) a singular leading 2×2 minor with det A = −1, like [[1,1,1],[1,1,2],[1,2,2]] in
 * references §4.12: LU without pivoting and LDLᵀ must reject both. A is never positive definite
 * (the leading 2×2 minor is pivot − 1 < 0, or the first pivot is ≤ 0), so Cholesky must reject.
 * By the block inverse with minij's tridiagonal inverse, ‖A⁻¹‖₁ ≤ 17 and κ₁ ≤ 17n².
 */
export const needsRowExchangeFamily: FamilyDefinition = {
  seeded: false,
  rectangular: false,
  params: {
    pivot: {
      default: 1e-20,
      check: (v) =>
        v === 0 || v === 1 || (v !== 0 && Math.abs(v) <= TINY)
          ? undefined
          : 'pivot must be 0, 1, or of magnitude at most 2^-20',
    },
  },
  check: ({ n, params }) =>
    n < 2
      ? 'needs-row-exchange needs n ≥ 2'
      : params.pivot === 1 && n < 3
        ? 'pivot = 1 needs n ≥ 3 (for n = 2 the matrix would be singular)'
        : undefined,
  build({ n, params }) {
    const pivot = params.pivot!;
    const data = new Float64Array(n * n);
    data[0] = pivot;
    data[1] = 1;
    data[n] = 1;
    for (let i = 1; i < n; i++) for (let j = 1; j < n; j++) data[i * n + j] = Math.min(i, j);
    const facts = exactFacts(data, n);
    const safe = clearlyNonsingular(n, facts?.condition1 ?? 17 * n * n);
    const zeroPivot = pivot === 0 || pivot === 1;
    return {
      data,
      properties: {
        positiveDefinite: false,
        singular: false,
        ...(facts?.condition1 !== undefined ? { exactCondition1: facts.condition1 } : {}),
        expectations: expectations({
          'lu-partial-pivoting': factorIf(safe),
          'lu-no-pivoting': zeroPivot ? 'reject' : factorIf(safe),
          cholesky: 'reject',
          ldlt: zeroPivot ? 'reject' : factorIf(safe),
          'householder-qr': 'factor',
          'back-substitution': factorIf(safe),
        }),
        note:
          pivot === 0
            ? 'Zero leading pivot: LU without pivoting and LDLᵀ must reject; GEPP just swaps rows.'
            : pivot === 1
              ? 'Singular leading 2×2 minor (det A = −1): LU without pivoting must reject, GEPP factors.'
              : `Tiny leading pivot ${pivot}: LU without pivoting "succeeds" with a huge factor ratio; GEPP is exact.`,
      },
    };
  },
};
