import { eq, sql } from 'drizzle-orm';
import { couldNotRunVerdict } from '@sandbox/trial/could-not-run-verdict.ts';
import type { Env } from '@server/config/env.ts';
import type { Db } from '@server/db/client.ts';
import { trials } from '@server/db/schema/trials.ts';
import { finishDriftCheck } from '@server/drift/drift-finish.ts';
import type { DbOrTx } from '@server/mail/outbox.repo.ts';
import { notifyTrialFinished } from '@server/trials/trial-notifications.ts';
import { moveCandidateAfterTrial } from './candidate-after-trial.ts';
import { finishedStatus, type FinishedTrial, type TrialEnd } from './finished-trial.ts';
import { deleteTrialResults, lockUnfinishedTrial } from './trial-job.repo.ts';
import { forJsonb, insertTrialResults } from './trial-result-rows.ts';

export type NotifyTrialFinished = (tx: DbOrTx, trialId: number, env: Env) => Promise<unknown>;

export interface TrialFinishDeps {
  db: Db;
  env: Env;
  /** Told in the final transaction (e-mail through the outbox); a stub in some tests. */
  notify?: NotifyTrialFinished;
}

function trialColumns(end: TrialEnd) {
  const status = finishedStatus(end);
  if (end.kind === 'report') {
    const { report } = end;
    const count = report.matrices.length;
    return {
      status,
      verdict: forJsonb(report.verdict),
      passed: report.verdict.passed,
      machine: forJsonb(report.machine),
      phases: forJsonb(report.phases),
      message: report.message ?? null,
      progress: { phase: 'done' as const, done: count, total: count },
    };
  }
  return {
    status,
    verdict: end.kind === 'cannot-run' ? couldNotRunVerdict(end.message) : null,
    passed: end.kind === 'cannot-run' ? false : null,
    message: end.message,
    progress: { phase: 'done' as const, done: 0, total: 0 },
  };
}

/**
 * The one transaction that ends a trial: its results (every per-matrix and per-size row), its
 * status, verdict, machine and phases, the candidate moved on (or the drift check judged), and
 * the notification. `attempt` is the try that produced `end`; when a later try has started, or
 * the trial is already finished, nothing is written and false is returned. Pass null for an
 * end decided outside any try (pg-boss gave up on the job).
 */
export async function finishTrial(
  deps: TrialFinishDeps,
  trialId: number,
  attempt: number | null,
  end: TrialEnd,
): Promise<boolean> {
  const notify = deps.notify ?? notifyTrialFinished;
  return deps.db.transaction(async (tx) => {
    const locked = await lockUnfinishedTrial(tx, trialId, attempt);
    if (!locked) return false;
    await deleteTrialResults(tx, trialId);
    if (end.kind === 'report') await insertTrialResults(tx, trialId, end.report);
    const [trial] = await tx
      .update(trials)
      .set({
        ...trialColumns(end),
        startedAt: sql`coalesce(${trials.startedAt}, now())`,
        finishedAt: sql`now()`,
      })
      .where(eq(trials.id, trialId))
      .returning();
    const finished: FinishedTrial = {
      trial: trial!,
      status: finishedStatus(end),
      report: end.kind === 'report' ? end.report : null,
      message: trial!.message,
    };
    if (trial!.purpose === 'candidate') await moveCandidateAfterTrial(tx, finished);
    else await finishDriftCheck(tx, deps.env, finished);
    await notify(tx, trialId, deps.env);
    return true;
  });
}
