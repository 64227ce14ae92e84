import type { TrialSummary } from '@shared/api/trials.ts';
import { reviveNonFinite } from '@shared/json-numbers.ts';
import {
  timingReportSchema,
  type KernelOutcome,
  type MatrixReport,
  type TimingReport,
} from '@shared/trial-report.ts';
import type { MatrixResultRow, TimingResultRow, TrialRow } from './trials.repo.ts';

/** Turns the strings "Infinity", "-Infinity" and "NaN" that JSON columns hold back into numbers. */
function reviveMetrics(metrics: Record<string, unknown>): KernelOutcome['metrics'] {
  const out: Record<string, number> = {};
  for (const [name, value] of Object.entries(metrics ?? {})) {
    const revived = reviveNonFinite(name, value);
    if (typeof revived === 'number') out[name] = revived;
  }
  return out;
}

function reviveOutcome(outcome: KernelOutcome): KernelOutcome {
  return { ...outcome, metrics: reviveMetrics(outcome.metrics as Record<string, unknown>) };
}

/** A per-matrix result row in the report's shape (rows written before 0002 have no growth). */
export function toMatrixReport(row: MatrixResultRow): MatrixReport {
  return {
    id: row.matrixId,
    family: row.family,
    m: row.m,
    n: row.n,
    condition: row.condition,
    conditionKind:
      row.conditionKind === 'exact' || row.conditionKind === 'estimate' ? row.conditionKind : null,
    expected: row.expected === 'reject' ? 'reject' : 'factor',
    referenceGrowth: row.referenceGrowth,
    referenceTrusted: row.referenceTrusted,
    note: row.note,
    candidate: reviveOutcome(row.candidate),
    incumbent: row.incumbent ? reviveOutcome(row.incumbent) : null,
    passed: row.passed,
    failures: row.failures,
  };
}

/** A timing row in the report's shape: the full report kept in `detail`, else the columns. */
export function toTimingReport(row: TimingResultRow): TimingReport {
  const detail = timingReportSchema.safeParse(row.detail);
  if (detail.success) return detail.data;
  return {
    n: row.n,
    rounds: row.rounds,
    candidate: row.candidateMs,
    incumbent: row.incumbentMs,
    candidateDetail: null,
    incumbentDetail: null,
    ratio: row.ratio,
    ci95: row.ciLow !== null && row.ciHigh !== null ? [row.ciLow, row.ciHigh] : null,
    pValue: null,
    verdict:
      row.verdict === 'faster' || row.verdict === 'slower' || row.verdict === 'no clear difference'
        ? row.verdict
        : null,
    flags: [],
  };
}

export function toTrialSummary(trial: TrialRow, candidateId: number): TrialSummary {
  return {
    id: trial.id,
    routineId: trial.routineId,
    revisionId: trial.revisionId,
    candidateId,
    incumbentRevisionId: trial.incumbentRevisionId,
    matrixSetId: trial.matrixSetId,
    purpose: trial.purpose,
    status: trial.status,
    progress: trial.progress,
    passed: trial.passed,
    message: trial.message,
    createdAt: trial.createdAt.toISOString(),
    startedAt: trial.startedAt?.toISOString() ?? null,
    finishedAt: trial.finishedAt?.toISOString() ?? null,
  };
}
