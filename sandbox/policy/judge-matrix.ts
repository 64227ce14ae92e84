import { formatValue } from '@shared/number-format.ts';
import type { AcceptancePolicy } from '@shared/acceptance-policy.ts';
import type { Expectation, RoutineSlug } from '@shared/routines.ts';
import type { KernelOutcome } from '@shared/trial-report.ts';

const fmt = formatValue;

/** Plain words for a call that did not return a usable result. */
export function describeStatus(outcome: KernelOutcome): string {
  const detail = outcome.message ? `: ${outcome.message}` : '';
  switch (outcome.status) {
    case 'ok':
      return 'returned a result';
    case 'threw':
      return `threw${detail}`;
    case 'timeout':
      return `ran past its time limit${detail}`;
    case 'out-of-memory':
      return `ran out of memory${detail}`;
    case 'invalid-output':
      return `returned an invalid result${detail}`;
    case 'non-finite':
      return `returned non-finite numbers${detail}`;
  }
}

/**
 * Judges the candidate on one matrix: a matrix that must be rejected needs a throw; one that
 * must factor needs a usable result whose accuracy ratios are within the policy's threshold
 * (LAPACK's convention: the factor ratio, and for QR also the orthogonality ratio; for back
 * substitution the solve residual ratio of dget02/dtrt02). The factor-ratio threshold is scaled
 * by the growth of the contract's own algorithm on the matrix (trial/reference-growth.ts), so a
 * sound GEPP kernel is not failed on a matrix where GEPP itself grows by 10⁶.
 */
export function judgeMatrix(
  routine: RoutineSlug,
  expected: Expectation,
  outcome: KernelOutcome,
  policy: AcceptancePolicy,
  referenceGrowth: number | null = null,
): { passed: boolean; failures: string[] } {
  if (expected === 'reject') {
    if (outcome.status === 'threw') return { passed: true, failures: [] };
    return {
      passed: false,
      failures: [`must be rejected, but the kernel ${describeStatus(outcome)}`],
    };
  }
  if (outcome.status !== 'ok')
    return { passed: false, failures: [`the kernel ${describeStatus(outcome)}`] };
  const failures: string[] = [];
  const growth = referenceGrowth !== null && referenceGrowth > 1 ? referenceGrowth : 1;
  const limit = policy.maxFactorRatio * growth;
  const limitText =
    growth > 1 ? `${policy.maxFactorRatio} × reference growth ${fmt(growth)}` : String(limit);
  const checks: [keyof KernelOutcome['metrics'], string][] =
    routine === 'back-substitution'
      ? [['solveResidualRatio', 'solve residual ratio']]
      : routine === 'householder-qr'
        ? [
            ['factorRatio', 'factor ratio'],
            ['orthogonalityRatio', 'orthogonality ratio'],
          ]
        : [['factorRatio', 'factor ratio']];
  for (const [metric, label] of checks) {
    const value = outcome.metrics[metric];
    if (value === undefined) failures.push(`${label} could not be computed`);
    else if (!(value <= (metric === 'factorRatio' ? limit : policy.maxFactorRatio))) {
      const bound = metric === 'factorRatio' ? limitText : String(policy.maxFactorRatio);
      failures.push(`${label} ${fmt(value)} exceeds ${bound}`);
    }
  }
  return { passed: failures.length === 0, failures };
}
