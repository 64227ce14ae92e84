import { formatValue } from '@shared/number-format.ts';
import type { MatrixReport, TrialReport } from '@shared/trial-report.ts';
import type { MetricsSnapshot } from '@server/db/schema/promotions.ts';

/**
 * Accuracy drifts when the worst ratio is more than 10× the one at promotion: the factor the
 * default acceptance policy allows a candidate to lose against the incumbent
 * (maxAccuracyLossFactor), with values below 1 counted as 1, since ratios scaled by the unit
 * roundoff below 1 are all "as good as it gets" (sandbox/policy/accuracy-comparison.ts).
 */
export const ACCURACY_DRIFT_FACTOR = 10;
const RATIO_FLOOR = 1;

/**
 * Time drifts when the median at a size is more than 1.25× the one at promotion: well beyond
 * the 0.91–1.09 spread of medians between runs of one kernel on this kind of machine
 * (numerics.md, "Timing"). Absolute times across runs also move with the machine's speed
 * (stack.md reports two levels about 1.6× apart), so a time finding asks for a look, not a
 * verdict.
 */
export const TIME_DRIFT_FACTOR = 1.25;

/** Worst value over the matrices that must factor; NaN and ±Infinity count as Infinity. */
function worstNow(
  matrices: readonly MatrixReport[],
  pick: (m: MatrixReport) => number | undefined,
) {
  let worst: number | null = null;
  for (const m of matrices) {
    if (m.expected !== 'factor' || m.candidate.status !== 'ok') continue;
    const v = pick(m);
    if (v === undefined) continue;
    const value = Number.isFinite(v) ? v : Infinity;
    if (worst === null || value > worst) worst = value;
  }
  return worst;
}

function accuracyFinding(label: string, now: number | null, then: number | null): string | null {
  if (now === null || then === null) return null;
  const factor = Math.max(now, RATIO_FLOOR) / Math.max(then, RATIO_FLOOR);
  if (!(factor > ACCURACY_DRIFT_FACTOR)) return null;
  return `The worst ${label} is now ${formatValue(now)}, against ${formatValue(then)} at promotion (${formatValue(factor)} times worse; the limit is ${ACCURACY_DRIFT_FACTOR}×).`;
}

/**
 * Compares a re-run of the incumbent with the snapshot kept at its promotion and lists, in
 * plain words, what drifted: matrices it must factor on which it no longer returns a result,
 * the worst factor ratio (solve residual ratio for back substitution) and the worst forward
 * error over its bound beyond ACCURACY_DRIFT_FACTOR, and timing sizes whose median is beyond
 * TIME_DRIFT_FACTOR. An empty list means steady.
 */
export function driftFindings(snapshot: MetricsSnapshot, report: TrialReport): string[] {
  const findings: string[] = [];
  for (const m of report.matrices) {
    if (m.expected === 'factor' && m.candidate.status !== 'ok') {
      findings.push(`On ${m.id} the incumbent no longer returns a result (${m.candidate.status}).`);
    }
  }
  const factor = accuracyFinding(
    'factor ratio',
    worstNow(
      report.matrices,
      (m) => m.candidate.metrics.factorRatio ?? m.candidate.metrics.solveResidualRatio,
    ),
    snapshot.worstFactorRatio,
  );
  if (factor) findings.push(factor);
  const forward = accuracyFinding(
    'forward error over its bound',
    worstNow(
      report.matrices.filter((m) => m.referenceTrusted),
      (m) => m.candidate.metrics.forwardErrorOverBound,
    ),
    snapshot.worstForwardErrorOverBound,
  );
  if (forward) findings.push(forward);

  for (const then of snapshot.timing) {
    const timing = report.timing.find((t) => t.n === then.n);
    const now = timing?.candidateDetail?.medianMs ?? timing?.candidate ?? null;
    if (now === null || then.medianMs === null || !(then.medianMs > 0)) continue;
    const factor = now / then.medianMs;
    if (factor > TIME_DRIFT_FACTOR) {
      findings.push(
        `At n = ${then.n} the median time is now ${formatValue(now)} ms, against ${formatValue(then.medianMs)} ms at promotion (${formatValue(factor)} times slower; the limit is ${TIME_DRIFT_FACTOR}×).`,
      );
    }
  }
  return findings;
}
