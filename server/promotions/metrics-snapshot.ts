import type { MatrixReport, TimingReport } from '@shared/trial-report.ts';
import type { MetricsSnapshot } from '@server/db/schema/promotions.ts';

/** The largest finite value, or null when there is none (JSON cannot carry Infinity). */
function worst(values: (number | undefined)[]): number | null {
  let max: number | null = null;
  for (const v of values) {
    if (v === undefined || !Number.isFinite(v)) continue;
    if (max === null || v > max) max = v;
  }
  return max;
}

const finiteOrNull = (v: number | null | undefined) =>
  v !== null && v !== undefined && Number.isFinite(v) ? v : null;

/**
 * The metrics kept with a promotion, from the candidate side of its trial: the worst factor
 * ratio over the matrices that must factor (the solve residual ratio for back substitution,
 * which has no factors), the worst forward error over its bound where the reference is trusted,
 * and per timing size the median time and GFLOP/s. Drift checks compare against these.
 */
export function metricsSnapshot(
  matrices: readonly MatrixReport[],
  timing: readonly TimingReport[],
): MetricsSnapshot {
  const factored = matrices.filter((m) => m.expected === 'factor');
  return {
    worstFactorRatio: worst(
      factored.map(
        (m) => m.candidate.metrics.factorRatio ?? m.candidate.metrics.solveResidualRatio,
      ),
    ),
    worstForwardErrorOverBound: worst(
      factored
        .filter((m) => m.referenceTrusted)
        .map((m) => m.candidate.metrics.forwardErrorOverBound),
    ),
    timing: timing.map((t) => ({
      n: t.n,
      medianMs: finiteOrNull(t.candidateDetail?.medianMs ?? t.candidate),
      gflops: finiteOrNull(t.candidateDetail?.gflops),
    })),
  };
}
