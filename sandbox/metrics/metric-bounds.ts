/**
 * Which metrics carry a pass threshold of their own, independent of any routine's acceptance
 * policy, and where the threshold comes from. Used by the policy to mark a value as failing.
 */
import { gamma } from '@sandbox/numerics/unit-roundoff.ts';
import type { MetricName } from './metric-names.ts';

/** A pass threshold: pass when value < limit ('below') or value ≤ limit ('at-most'). */
export interface MetricBound {
  readonly limit: number;
  readonly pass: 'below' | 'at-most';
  readonly source: string;
}

const lapackThreshold: MetricBound = {
  limit: 30,
  pass: 'below',
  // TESTING/dtest.in line 13 "30.0 Threshold value of test ratio"; dchkge.f and dchkqr.f report a
  // failure when RESULT(K) .GE. THRESH, for every LAPACK test ratio.
  source: 'LAPACK TESTING/dtest.in threshold 30; dchkge.f fails a ratio ≥ THRESH',
};

/** Metrics with a pass threshold; the others (growth, backward and forward errors) have none. */
export const metricBounds: Readonly<Partial<Record<MetricName, MetricBound>>> = {
  factorRatio: lapackThreshold,
  orthogonalityRatio: lapackThreshold,
  solveResidualRatio: lapackThreshold,
  componentwiseBoundRatio: {
    limit: 1,
    pass: 'at-most',
    source: 'Higham, ASNA 2nd ed., Thm 9.3 (LU) and Thm 10.3 (Cholesky), from memory',
  },
};

/** true/false against the metric's bound, or undefined when the metric has none. NaN fails. */
export function passesBound(name: MetricName, value: number): boolean | undefined {
  const bound = metricBounds[name];
  if (bound === undefined) return undefined;
  return bound.pass === 'below' ? value < bound.limit : value <= bound.limit;
}

/**
 * γ_n, the componentwise backward error a backward stable back substitution of order n stays
 * within: (U + ΔU)x̂ = b with |ΔU| ≤ γ_n|U| (Higham, ASNA 2nd ed., Thm 8.5, from memory), so
 * ω ≤ γ_n. Depends on n, hence a function rather than an entry of metricBounds.
 */
export function backSubstitutionBackwardErrorLimit(n: number): number {
  if (!Number.isInteger(n) || n < 0)
    throw new RangeError(`n must be a non-negative integer, got ${n}`);
  return gamma(n);
}
