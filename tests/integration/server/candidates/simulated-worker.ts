import { eq, sql } from 'drizzle-orm';
import type { Env } from '@server/config/env.ts';
import type { Db } from '@server/db/client.ts';
import { candidates } from '@server/db/schema/candidates.ts';
import { revisions } from '@server/db/schema/revisions.ts';
import { trialMatrixResults, trialTimingResults } from '@server/db/schema/trial-results.ts';
import { trials, type TrialProgressRecord } from '@server/db/schema/trials.ts';
import { notifyTrialFinished } from '@server/trials/trial-notifications.ts';
import type { KernelOutcome, TimingReport } from '@shared/trial-report.ts';

/** Invented results of a trial, as the worker stores them (non-finite values as strings). */
export function sampleMatrixRows(trialId: number): (typeof trialMatrixResults.$inferInsert)[] {
  const rows = [
    {
      trialId,
      position: 0,
      matrixId: 'hilbert-8',
      family: 'hilbert',
      m: 8,
      n: 8,
      condition: 3.4e10,
      conditionKind: 'exact',
      referenceGrowth: 1.0,
      expected: 'factor',
      referenceTrusted: true,
      note: '',
      candidate: {
        status: 'ok' as const,
        metrics: { factorRatio: 0.42, growthFactor: 1.0, forwardErrorOverBound: 0.031 },
        ms: 0.12,
      },
      incumbent: {
        status: 'ok' as const,
        metrics: { factorRatio: 0.5, growthFactor: 1.0, forwardErrorOverBound: 0.04 },
        ms: 0.14,
      },
      passed: true,
      failures: [],
    },
    {
      trialId,
      position: 1,
      matrixId: 'frame-bay-3, "east"',
      family: 'upload',
      m: 12,
      n: 12,
      condition: 8.1e5,
      conditionKind: 'estimate',
      referenceGrowth: 2.25,
      expected: 'factor',
      referenceTrusted: true,
      note: 'uploaded stiffness matrix',
      candidate: {
        status: 'ok' as const,
        metrics: { factorRatio: 1.7, growthFactor: 2.5, forwardErrorOverBound: 0.2 },
        ms: 0.3,
      },
      // JSON columns hold non-finite values as strings (shared/json-numbers.ts).
      incumbent: {
        status: 'ok',
        metrics: { factorRatio: 'Infinity', growthFactor: 'NaN' },
        ms: 0.31,
      } as unknown as KernelOutcome,
      passed: true,
      failures: [],
    },
    {
      trialId,
      position: 2,
      matrixId: 'singular-6',
      family: 'singular',
      m: 6,
      n: 6,
      condition: Infinity,
      conditionKind: 'exact',
      expected: 'reject',
      referenceTrusted: false,
      note: 'rank 5',
      candidate: { status: 'threw' as const, message: 'singular matrix', metrics: {}, ms: 0.01 },
      incumbent: null,
      passed: true,
      failures: [],
    },
  ];
  return rows;
}

const timing64: TimingReport = {
  n: 64,
  rounds: 21,
  candidate: 0.48,
  incumbent: 0.55,
  candidateDetail: { medianMs: 0.48, q1Ms: 0.47, q3Ms: 0.5, gflops: 0.36 },
  incumbentDetail: { medianMs: 0.55, q1Ms: 0.54, q3Ms: 0.57, gflops: 0.32 },
  ratio: 0.87,
  ci95: [0.84, 0.9],
  pValue: 0.001,
  verdict: 'faster',
  flags: [],
};

const machine = {
  cpuModel: 'Invented CPU 3000',
  cores: 8,
  totalMemoryBytes: 16e9,
  platform: 'linux',
  nodeVersion: '20.19.0',
  v8Version: '11.3',
  isolatedVmVersion: '5.0.4',
};

/** Writes a trial's progress as the worker does while it runs. */
export async function writeProgress(db: Db, trialId: number, progress: TrialProgressRecord) {
  await db
    .update(trials)
    .set({ status: 'running', progress, startedAt: sql`coalesce(${trials.startedAt}, now())` })
    .where(eq(trials.id, trialId));
}

/**
 * Finishes a trial as the worker would, in one transaction: the results, the verdict, the
 * candidate moved from on trial to in review, and the worker's call to notifyTrialFinished.
 */
export async function finishTrial(
  db: Db,
  env: Env,
  trialId: number,
  passed = true,
): Promise<number[]> {
  return db.transaction(async (tx) => {
    await tx.insert(trialMatrixResults).values(sampleMatrixRows(trialId));
    await tx.insert(trialTimingResults).values({
      trialId,
      n: 64,
      rounds: 21,
      candidateMs: 0.48,
      incumbentMs: 0.55,
      ratio: 0.87,
      ciLow: 0.84,
      ciHigh: 0.9,
      verdict: 'faster',
      detail: timing64,
    });
    const [trial] = await tx
      .update(trials)
      .set({
        status: 'completed',
        passed,
        progress: { phase: 'done', done: 3, total: 3 },
        machine,
        phases: {
          compileMs: 40,
          matricesMs: 5,
          kernelMs: 12,
          referenceMs: 30,
          metricsMs: 3,
          timingMs: 900,
          totalMs: 990,
        },
        verdict: {
          passed,
          rules: [{ rule: 'factor-accuracy', passed, reason: 'invented', offenders: [] }],
        },
        startedAt: sql`coalesce(${trials.startedAt}, now())`,
        finishedAt: sql`now()`,
      })
      .where(eq(trials.id, trialId))
      .returning();
    const [revision] = await tx.select().from(revisions).where(eq(revisions.id, trial!.revisionId));
    await tx
      .update(candidates)
      .set({ state: 'in-review' })
      .where(eq(candidates.id, revision!.candidateId));
    return notifyTrialFinished(tx, trialId, env);
  });
}
