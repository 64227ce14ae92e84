import { and, eq, inArray, sql } from 'drizzle-orm';
import type { Db } from '@server/db/client.ts';
import { trialMatrixResults, trialTimingResults } from '@server/db/schema/trial-results.ts';
import { trials, type TrialProgressRecord } from '@server/db/schema/trials.ts';
import type { DbOrTx } from '@server/mail/outbox.repo.ts';
import type { TrialRow } from './finished-trial.ts';

export type AttemptStart =
  | { kind: 'started'; trial: TrialRow; attempt: number }
  | { kind: 'missing' }
  | { kind: 'already-finished'; status: TrialRow['status'] };

const unfinished = ['queued', 'running'] as const;

export async function deleteTrialResults(tx: DbOrTx, trialId: number): Promise<void> {
  await tx.delete(trialMatrixResults).where(eq(trialMatrixResults.trialId, trialId));
  await tx.delete(trialTimingResults).where(eq(trialTimingResults.trialId, trialId));
}

/**
 * Starts a try of a trial in one short transaction: the row, locked, becomes running with one
 * more attempt and a fresh start time, and any results of an earlier try are deleted (results
 * are only written in the final transaction, so normally there are none). A finished trial is
 * left alone, which makes a redelivered job harmless.
 */
export async function startAttempt(db: Db, trialId: number): Promise<AttemptStart> {
  return db.transaction(async (tx) => {
    const [row] = await tx.select().from(trials).where(eq(trials.id, trialId)).for('update');
    if (!row) return { kind: 'missing' };
    if (!(unfinished as readonly string[]).includes(row.status)) {
      return { kind: 'already-finished', status: row.status };
    }
    await deleteTrialResults(tx, trialId);
    const [started] = await tx
      .update(trials)
      .set({
        status: 'running',
        attempts: sql`${trials.attempts} + 1`,
        startedAt: sql`now()`,
        finishedAt: null,
        message: null,
        progress: { phase: 'compile', done: 0, total: 0 },
      })
      .where(eq(trials.id, trialId))
      .returning();
    return { kind: 'started', trial: started!, attempt: started!.attempts };
  });
}

/** Progress of the running try `attempt`; a write from a superseded try changes nothing. */
export async function writeTrialProgress(
  db: Db,
  trialId: number,
  attempt: number,
  progress: TrialProgressRecord,
): Promise<void> {
  await db
    .update(trials)
    .set({ progress })
    .where(and(eq(trials.id, trialId), eq(trials.attempts, attempt), eq(trials.status, 'running')));
}

/**
 * Locks the trial for its final write. Returns null when the trial is finished, or when
 * `attempt` is given and a later try has started since (that try owns the results now).
 */
export async function lockUnfinishedTrial(
  tx: DbOrTx,
  trialId: number,
  attempt: number | null,
): Promise<TrialRow | null> {
  const [row] = await tx
    .select()
    .from(trials)
    .where(and(eq(trials.id, trialId), inArray(trials.status, [...unfinished])))
    .for('update');
  if (!row) return null;
  if (attempt !== null && (row.attempts !== attempt || row.status !== 'running')) return null;
  return row;
}
