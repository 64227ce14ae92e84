import { stringifyWithNonFinite } from '@shared/json-numbers.ts';
import type { KernelOutcome, TrialReport } from '@shared/trial-report.ts';
import { trialMatrixResults, trialTimingResults } from '@server/db/schema/trial-results.ts';
import type { DbOrTx } from '@server/mail/outbox.repo.ts';

type MatrixInsert = typeof trialMatrixResults.$inferInsert;
type TimingInsert = typeof trialTimingResults.$inferInsert;

/**
 * A value for a jsonb column: JSON has no Infinity or NaN, and JSON.stringify would turn them
 * into null, so they travel as the strings "Infinity", "-Infinity" and "NaN"
 * (shared/json-numbers.ts; the trials API revives them). Double precision columns take them as
 * they are: PostgreSQL accepts 'Infinity' and 'NaN' for float8.
 */
export function forJsonb<T>(value: T): T {
  return JSON.parse(stringifyWithNonFinite(value)) as T;
}

export function matrixResultRows(trialId: number, report: TrialReport): MatrixInsert[] {
  return report.matrices.map((m, position) => ({
    trialId,
    position,
    matrixId: m.id,
    family: m.family,
    m: m.m,
    n: m.n,
    condition: m.condition,
    conditionKind: m.conditionKind,
    referenceGrowth: m.referenceGrowth,
    expected: m.expected,
    referenceTrusted: m.referenceTrusted,
    note: m.note,
    candidate: forJsonb<KernelOutcome>(m.candidate),
    incumbent: m.incumbent ? forJsonb<KernelOutcome>(m.incumbent) : null,
    passed: m.passed,
    failures: m.failures,
  }));
}

export function timingResultRows(trialId: number, report: TrialReport): TimingInsert[] {
  return report.timing.map((t) => ({
    trialId,
    n: t.n,
    rounds: t.rounds,
    candidateMs: t.candidate,
    incumbentMs: t.incumbent,
    ratio: t.ratio,
    ciLow: t.ci95?.[0] ?? null,
    ciHigh: t.ci95?.[1] ?? null,
    verdict: t.verdict,
    detail: forJsonb(t),
  }));
}

/** Writes a report's per-matrix and per-size rows (inside the final transaction). */
export async function insertTrialResults(
  tx: DbOrTx,
  trialId: number,
  report: TrialReport,
): Promise<void> {
  const matrices = matrixResultRows(trialId, report);
  const timing = timingResultRows(trialId, report);
  if (matrices.length > 0) await tx.insert(trialMatrixResults).values(matrices);
  if (timing.length > 0) await tx.insert(trialTimingResults).values(timing);
}
