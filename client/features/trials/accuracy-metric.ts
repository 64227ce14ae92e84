import type { MatrixReport } from '@shared/trial-report.ts';

/**
 * The headline error ratio of one kernel on one matrix: the factor ratio, or for back
 * substitution (which has no factor) the solve residual ratio, as the policy reads them.
 */
export function headlineRatio(
  outcome: MatrixReport['candidate'] | null | undefined,
): number | undefined {
  if (!outcome) return undefined;
  return outcome.metrics.factorRatio ?? outcome.metrics.solveResidualRatio;
}
