import { exactFacts } from '@sandbox/matrices/exact-analysis.ts';
import { expectations } from '@sandbox/matrices/expectation-rules.ts';
import type { FamilyDefinition } from '@sandbox/matrices/family-definition.ts';

/**
 * nearly-singular: C_δ = [[1, 2, 3], [4, 5, 6], [7, 8, 9 + δ]] in the leading 3×3 block and the
 * identity after it (n ≥ 3). det C_δ = −3δ; LU without pivoting gives the pivots 1, −3, δ with
 * no rounding, GEPP's last pivot is −δ/2 plus rounding of order u·‖C‖ (derived by elimination), and
 * κ₁ ≈ 144/δ. With the default δ = 2^-40, κ₁ ≈ 1.6e14: nearly singular, not singular, so every
 * LU must factor it and be judged by backward error. δ = 0 gives the classic rank-2 matrix, whose
 * GEPP pivot U₃₃ = 2^-53 is a rounding accident, not 0 (references §4.11): it is not must-reject,
 * so only no-pivot LU (exact zero pivot, small integers) and QR keep an expectation.
 * For δ ≤ 1/4, ‖C⁻¹‖₁ ≥ |(C⁻¹)₁₁| = (3 − 5δ)/(3δ) ≥ 1 and ‖C‖₁ ≥ 18, so κ₁(A) = κ₁(C_δ).
 */
export const nearlySingularFamily: FamilyDefinition = {
  seeded: false,
  rectangular: false,
  params: {
    delta: {
      default: 2 ** -40,
      check: (v) =>
        v === 0 || (v >= 2 ** -44 && v <= 0.25 && 9 + v - 9 === v)
          ? undefined
          : 'delta must be 0, or from 2^-44 to 0.25 with 9 + delta exact in double',
    },
  },
  check: ({ n }) => (n < 3 ? 'nearly-singular needs n ≥ 3' : undefined),
  build({ n, params }) {
    const delta = params.delta!;
    const data = new Float64Array(n * n);
    const c = [1, 2, 3, 4, 5, 6, 7, 8, 9 + delta];
    for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) data[i * n + j] = c[i * 3 + j]!;
    for (let i = 3; i < n; i++) data[i * n + i] = 1;
    const facts = exactFacts(c, 3);
    const singular = delta === 0;
    return {
      data,
      properties: {
        positiveDefinite: false,
        singular,
        ...(facts?.condition1 !== undefined ? { exactCondition1: facts.condition1 } : {}),
        expectations: singular
          ? expectations({ 'lu-no-pivoting': 'reject', 'householder-qr': 'factor' })
          : expectations({
              'lu-partial-pivoting': 'factor',
              'lu-no-pivoting': 'factor',
              'householder-qr': 'factor',
              'back-substitution': 'factor',
            }),
        note: singular
          ? 'Rank-2 [[1,2,3],[4,5,6],[7,8,9]]: GEPP meets 2^-53, not 0; judge by backward error, not by rejection.'
          : `[[1,2,3],[4,5,6],[7,8,9+δ]], δ = ${delta}: nearly singular (κ₁ ≈ 144/δ), must be factored.`,
      },
    };
  },
};
