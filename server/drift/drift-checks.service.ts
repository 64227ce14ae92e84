import type { Db } from '@server/db/client.ts';
import type { TrialQueue } from '@server/jobs/trial-queue.ts';
import {
  hasPendingDriftCheck,
  insertDriftCheck,
  latestPromotionOf,
  lockRoutine,
  routineIdsWithIncumbent,
} from './drift-checks.repo.ts';

export interface StartedDriftCheck {
  routineId: number;
  driftCheckId: number;
  trialId: number;
}

/**
 * Starts a drift check of every routine that has an incumbent: a `drift_checks` row and a trial
 * of the incumbent revision on the routine's matrix set (purpose drift-check, nothing beside
 * it), queued for a worker; the worker compares the result with the snapshot kept at the
 * incumbent's promotion when the trial finishes (drift-finish.ts). A routine skips this round
 * when its previous check is still waiting or running, or when no promotion of its incumbent
 * is on record (there is nothing to compare with). The pg-boss schedule calls this; so can
 * tests and an admin route (`routineIds` limits the round to some routines). Returns the
 * checks started.
 */
export async function runDriftChecks(
  db: Db,
  queue: TrialQueue,
  options: { routineIds?: readonly number[] } = {},
): Promise<StartedDriftCheck[]> {
  const started: StartedDriftCheck[] = [];
  const wanted = options.routineIds;
  for (const routineId of await routineIdsWithIncumbent(db)) {
    if (wanted && !wanted.includes(routineId)) continue;
    const made = await db.transaction(async (tx) => {
      // The lock keeps two overlapping runs from starting two checks of one routine.
      const routine = await lockRoutine(tx, routineId);
      const incumbentRevisionId = routine?.incumbentRevisionId ?? null;
      if (!routine || incumbentRevisionId === null) return null;
      if (await hasPendingDriftCheck(tx, routineId)) return null;
      const promotion = await latestPromotionOf(tx, routineId, incumbentRevisionId);
      if (!promotion) return null;
      return insertDriftCheck(tx, { ...routine, incumbentRevisionId }, promotion.id);
    });
    if (!made) continue;
    // Queued after commit, so the worker finds the rows; a lost enqueue leaves the trial
    // queued, and the next round starts a fresh check once a day has passed.
    await queue.enqueueTrial(made.trialId);
    started.push({ routineId, ...made });
  }
  return started;
}
