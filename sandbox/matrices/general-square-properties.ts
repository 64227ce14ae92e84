import { exactFacts } from '@sandbox/matrices/exact-analysis.ts';
import { clearlyNonsingular, expectations, factorIf } from '@sandbox/matrices/expectation-rules.ts';
import type { FamilyProperties } from '@sandbox/matrices/family-definition.ts';
import {
  PIVOT_MARGIN_ORDER_LIMIT,
  SAFE_PIVOT_MARGIN,
  pivotMargins,
} from '@sandbox/matrices/pivot-margins.ts';

/** What a general square family tells generalSquareProperties about its matrix. */
export interface GeneralKnowledge {
  note: string;
  /**
   * 'random' for independent random entries: far from singular, with pivots far from zero, with
   * overwhelming probability (A. Edelman, SIAM J. Matrix Anal. Appl. 9 (1988) 543–560: κ grows
   * like n for Gaussian matrices, from memory); 'structured' otherwise.
   */
  kind: 'random' | 'structured';
  /** An upper bound on κ₁, used when neither exact facts nor pivot margins are available. */
  condition1Bound?: number;
}

/**
 * Properties of a general (non-symmetric) square matrix: exact facts when cheap
 * (exact-analysis.ts), pivot margins of the two eliminations up to n = 512 (pivot-margins.ts; up
 * to n = 64 for random matrices, where they only confirm the obvious), else the family's
 * knowledge. LU with and without pivoting and back substitution are 'factor' when their pivots
 * are far from rounding noise; Householder QR always applies.
 */
export function generalSquareProperties(
  data: Float64Array,
  n: number,
  known: GeneralKnowledge,
): FamilyProperties {
  const facts = exactFacts(data, n);
  const singular = facts?.singular ?? false;
  const limit = known.kind === 'random' ? 64 : PIVOT_MARGIN_ORDER_LIMIT;
  const margins = n <= limit ? pivotMargins(data, n) : undefined;
  const fallback =
    known.kind === 'random' || clearlyNonsingular(n, facts?.condition1 ?? known.condition1Bound);
  const lu = !singular && (margins ? margins.partialPivoting >= SAFE_PIVOT_MARGIN : fallback);
  const noPivot =
    !singular &&
    facts?.firstZeroLeadingMinor === undefined &&
    (margins ? margins.noPivoting >= SAFE_PIVOT_MARGIN : fallback);
  return {
    positiveDefinite: false,
    singular,
    ...(facts?.condition1 !== undefined ? { exactCondition1: facts.condition1 } : {}),
    expectations: expectations({
      'lu-partial-pivoting': factorIf(lu),
      'lu-no-pivoting': factorIf(noPivot),
      'householder-qr': 'factor',
      'back-substitution': factorIf(lu),
    }),
    note: known.note,
  };
}
