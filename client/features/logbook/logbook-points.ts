import type { Logbook } from '@shared/api/logbook.ts';
import type { TrialDetail } from '@shared/api/trials.ts';

/** One measurement of an incumbent in the logbook: at a promotion, or at a drift check. */
export interface LogbookPoint {
  at: Date;
  source: 'promotion' | 'drift check';
  /** A words label: "promoted Blocked LU r2", "drift check: drifted". */
  label: string;
  trialId: number;
  revisionNumber: number | null;
  worstFactorRatio: number | null;
  timing: { n: number; medianMs: number | null }[];
}

function worstFinite(values: (number | undefined)[]): number | null {
  let max: number | null = null;
  for (const v of values) {
    if (v === undefined || !Number.isFinite(v)) continue;
    if (max === null || v > max) max = v;
  }
  return max;
}

/**
 * The same figures a promotion keeps in its metrics snapshot, read from a drift check's trial:
 * the worst factor ratio (solve residual ratio for back substitution) over the matrices that
 * must factor, and the median time per size.
 */
export function metricsOfTrial(
  trial: TrialDetail,
): Pick<LogbookPoint, 'worstFactorRatio' | 'timing'> {
  const factored = trial.matrices.filter((m) => m.expected === 'factor');
  return {
    worstFactorRatio: worstFinite(
      factored.map(
        (m) => m.candidate.metrics.factorRatio ?? m.candidate.metrics.solveResidualRatio,
      ),
    ),
    timing: trial.timing.map((t) => {
      const median = t.candidateDetail?.medianMs ?? t.candidate;
      return { n: t.n, medianMs: median !== null && Number.isFinite(median) ? median : null };
    }),
  };
}

/** Every point of the logbook, oldest first; drift checks whose trial is not loaded are left out. */
export function logbookPoints(
  logbook: Logbook,
  driftTrials: ReadonlyMap<number, TrialDetail>,
): LogbookPoint[] {
  const revisionOfPromotion = new Map(logbook.promotions.map((p) => [p.id, p.revisionNumber]));
  const points: LogbookPoint[] = logbook.promotions.map((p) => ({
    at: new Date(p.createdAt),
    source: 'promotion',
    label: `${p.kind === 'promote' ? 'promoted' : 'reinstated'} ${p.candidateTitle} r${p.revisionNumber}`,
    trialId: p.trialId,
    revisionNumber: p.revisionNumber,
    worstFactorRatio: p.metricsSnapshot.worstFactorRatio,
    timing: p.metricsSnapshot.timing.map((t) => ({ n: t.n, medianMs: t.medianMs })),
  }));
  for (const check of logbook.driftChecks) {
    const trial = check.trialId === null ? undefined : driftTrials.get(check.trialId);
    if (!trial || trial.status !== 'completed' || check.trialId === null) continue;
    points.push({
      at: new Date(check.finishedAt ?? check.createdAt),
      source: 'drift check',
      label: `drift check: ${check.status ?? 'running'}`,
      trialId: check.trialId,
      revisionNumber: revisionOfPromotion.get(check.promotionId) ?? null,
      ...metricsOfTrial(trial),
    });
  }
  return points.sort((a, b) => a.at.getTime() - b.at.getTime());
}
