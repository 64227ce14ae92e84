import { asc, eq } from 'drizzle-orm';
import type { Db } from '@server/db/client.ts';
import { candidates } from '@server/db/schema/candidates.ts';
import { emailOutbox } from '@server/db/schema/email-outbox.ts';
import { trialMatrixResults, trialTimingResults } from '@server/db/schema/trial-results.ts';
import { trials } from '@server/db/schema/trials.ts';
import { waitFor } from './job-world.ts';

export async function trialRow(db: Db, id: number) {
  const [row] = await db.select().from(trials).where(eq(trials.id, id));
  return row!;
}

export async function candidateState(db: Db, id: number) {
  const [row] = await db
    .select({ state: candidates.state })
    .from(candidates)
    .where(eq(candidates.id, id));
  return row!.state;
}

export async function matrixRows(db: Db, trialId: number) {
  return db
    .select()
    .from(trialMatrixResults)
    .where(eq(trialMatrixResults.trialId, trialId))
    .orderBy(asc(trialMatrixResults.position));
}

export async function timingRows(db: Db, trialId: number) {
  return db
    .select()
    .from(trialTimingResults)
    .where(eq(trialTimingResults.trialId, trialId))
    .orderBy(asc(trialTimingResults.n));
}

export async function outboxTo(db: Db, address: string) {
  return db.select().from(emailOutbox).where(eq(emailOutbox.toAddress, address));
}

/** The trial once it has left queued/running. */
export function finishedTrial(db: Db, id: number, limitMs = 90_000) {
  return waitFor(
    async () => {
      const row = await trialRow(db, id);
      return row.status !== 'queued' && row.status !== 'running' ? row : null;
    },
    `trial ${id} to finish`,
    limitMs,
  );
}
