import type { MatrixReport } from '@shared/trial-report.ts';
import { UNIT_ROUNDOFF } from '../numerics/unit-roundoff.ts';
import type { MetricName } from '../metrics/metric-names.ts';

/**
 * The accuracy metrics compared with the incumbent, each with the floor below which a value
 * counts as "as good as it gets", so that 1e-18 against 1e-17 is not called a tenfold loss.
 * Ratios already scaled by u have floor 1; raw relative errors have floor u. Growth is not an
 * error measure and is not compared here.
 */
export const comparedMetrics: Partial<Record<MetricName, number>> = {
  factorRatio: 1,
  orthogonalityRatio: 1,
  solveResidualRatio: 1,
  componentwiseBoundRatio: 1e-3,
  normwiseBackwardError: UNIT_ROUNDOFF,
  componentwiseBackwardError: UNIT_ROUNDOFF,
  forwardError: UNIT_ROUNDOFF,
};

export interface AccuracyLoss {
  metric: MetricName;
  candidate: number;
  incumbent: number;
  factor: number;
}

/** Metrics on which the candidate is worse than the incumbent by more than `maxFactor`. */
export function accuracyLosses(report: MatrixReport, maxFactor: number): AccuracyLoss[] {
  const incumbent = report.incumbent;
  if (!incumbent || incumbent.status !== 'ok' || report.candidate.status !== 'ok') return [];
  const losses: AccuracyLoss[] = [];
  for (const [name, floor] of Object.entries(comparedMetrics) as [MetricName, number][]) {
    const c = report.candidate.metrics[name];
    const i = incumbent.metrics[name];
    if (c === undefined || i === undefined) continue;
    const factor = Math.max(c, floor) / Math.max(i, floor);
    // A non-finite candidate value against a finite incumbent is a loss without bound.
    if (factor > maxFactor || (!Number.isFinite(c) && Number.isFinite(i))) {
      losses.push({ metric: name, candidate: c, incumbent: i, factor });
    }
  }
  return losses;
}
