import { exactFacts } from '@sandbox/matrices/exact-analysis.ts';
import { expectations } from '@sandbox/matrices/expectation-rules.ts';
import type { FamilyProperties } from '@sandbox/matrices/family-definition.ts';

/**
 * Properties of a general square matrix (entry (i, j) of the n×n data at data[i*n + j]) that its
 * family proves nonsingular, with every pivot of LU with and without pivoting away from zero:
 * not positive definite, the exact κ₁ when exact-analysis.ts finds it cheaply, and 'factor' for
 * both LUs, Householder QR and back substitution. The family's doc comment carries the proof
 * (references §3 for worst-growth, §4.7 for kahan). Cost: that of exactFacts.
 */
export function factorableGeneralProperties(
  data: Float64Array,
  n: number,
  note: string,
): FamilyProperties {
  const facts = exactFacts(data, n);
  return {
    positiveDefinite: false,
    singular: false,
    ...(facts?.condition1 !== undefined ? { exactCondition1: facts.condition1 } : {}),
    expectations: expectations({
      'lu-partial-pivoting': 'factor',
      'lu-no-pivoting': 'factor',
      'householder-qr': 'factor',
      'back-substitution': 'factor',
    }),
    note,
  };
}
