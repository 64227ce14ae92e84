import { exactFacts } from '@sandbox/matrices/exact-analysis.ts';
import { clearlyNonsingular, expectations, factorIf } from '@sandbox/matrices/expectation-rules.ts';
import type { FamilyProperties } from '@sandbox/matrices/family-definition.ts';
import {
  PIVOT_MARGIN_ORDER_LIMIT,
  SAFE_PIVOT_MARGIN,
  pivotMargins,
} from '@sandbox/matrices/pivot-margins.ts';

/** What an SPD family knows about its stored matrix besides what exact analysis finds. */
export interface SpdKnowledge {
  note: string;
  /** The stored matrix is positive definite by construction (used when exact analysis is too costly). */
  positiveDefinite: boolean;
  /** Exact κ₁ of the stored matrix from a closed form, if the family has one. */
  condition1?: number;
  /** An upper bound on κ₁, used when the exact value is unknown. */
  condition1Bound?: number;
  /**
   * Cholesky, LDLᵀ and LU without pivoting run without any rounding error on this matrix (small
   * integers throughout), so they succeed however ill-conditioned it is.
   */
  exactFactors?: boolean;
}

/**
 * Properties of a symmetric matrix meant to be positive definite. Definiteness comes from exact
 * analysis when cheap (all leading principal minors positive: Sylvester's criterion; Horn &
 * Johnson, Matrix Analysis, Thm 7.2.5, from memory), else from the family. The LU routines and
 * back substitution are 'factor' when κ₁ is modest (expectation-rules.ts) or, up to n = 512,
 * when their pivots are far from rounding noise (pivot-margins.ts); Cholesky, LDLᵀ and LU without
 * pivoting likewise, or when the family factors exactly. This helper never says 'reject'.
 */
export function spdProperties(
  data: Float64Array,
  n: number,
  known: SpdKnowledge,
): FamilyProperties {
  const facts = exactFacts(data, n);
  const positiveDefinite = facts ? facts.leadingMinorsPositive : known.positiveDefinite;
  const condition1 = facts?.condition1 ?? known.condition1;
  const singular = facts?.singular ?? false;
  const modest = !singular && clearlyNonsingular(n, condition1 ?? known.condition1Bound);
  const margins = !modest && n <= PIVOT_MARGIN_ORDER_LIMIT ? pivotMargins(data, n) : undefined;
  const lu = modest || (margins !== undefined && margins.partialPivoting >= SAFE_PIVOT_MARGIN);
  const noPivot =
    positiveDefinite &&
    (modest ||
      known.exactFactors === true ||
      (margins !== undefined &&
        margins.noPivotingPositive &&
        margins.noPivoting >= SAFE_PIVOT_MARGIN));
  return {
    positiveDefinite,
    singular,
    ...(condition1 !== undefined ? { exactCondition1: condition1 } : {}),
    expectations: expectations({
      'lu-partial-pivoting': factorIf(lu),
      'lu-no-pivoting': factorIf(noPivot),
      cholesky: factorIf(noPivot),
      ldlt: factorIf(noPivot),
      'householder-qr': 'factor',
      'back-substitution': factorIf(lu),
    }),
    note: known.note,
  };
}
