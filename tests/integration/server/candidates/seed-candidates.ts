import { createHash } from 'node:crypto';
import { eq } from 'drizzle-orm';
import type { CandidateState } from '@shared/states.ts';
import type { Db } from '@server/db/client.ts';
import { candidates } from '@server/db/schema/candidates.ts';
import { promotions } from '@server/db/schema/promotions.ts';
import { reviews } from '@server/db/schema/reviews.ts';
import { revisions } from '@server/db/schema/revisions.ts';
import { routines } from '@server/db/schema/routines.ts';
import { trialMatrixResults } from '@server/db/schema/trial-results.ts';
import { trials } from '@server/db/schema/trials.ts';
import { goodKernel, type RoutineRow } from './review-world.ts';
import { sampleMatrixRows } from './simulated-worker.ts';

export interface SeededCandidate {
  candidateId: number;
  revisionId: number;
  trialId: number;
}

/**
 * A candidate straight in the database, in `state`, with revision 1 and a completed, passing
 * trial with results; `signOffBy` adds sign-offs on that revision.
 */
export async function seedCandidate(
  db: Db,
  routine: RoutineRow,
  authorId: number,
  state: CandidateState,
  signOffBy: number[] = [],
): Promise<SeededCandidate> {
  const [candidate] = await db
    .insert(candidates)
    .values({ routineId: routine.id, authorId, title: `Blocked LU (${state})`, state })
    .returning();
  const [revision] = await db
    .insert(revisions)
    .values({
      candidateId: candidate!.id,
      number: 1,
      source: goodKernel,
      sourceHash: createHash('sha256').update(goodKernel).digest('hex'),
      diagnostics: [],
      createdBy: authorId,
    })
    .returning();
  const [trial] = await db
    .insert(trials)
    .values({
      routineId: routine.id,
      revisionId: revision!.id,
      incumbentRevisionId: routine.incumbentRevisionId,
      matrixSetId: routine.matrixSetId,
      status: 'completed',
      passed: true,
      progress: { phase: 'done', done: 3, total: 3 },
      finishedAt: new Date(),
    })
    .returning();
  await db.insert(trialMatrixResults).values(sampleMatrixRows(trial!.id));
  for (const reviewerId of signOffBy) {
    await db.insert(reviews).values({
      candidateId: candidate!.id,
      revisionId: revision!.id,
      reviewerId,
      verdict: 'sign-off',
    });
  }
  return { candidateId: candidate!.id, revisionId: revision!.id, trialId: trial!.id };
}

/**
 * Two promoted candidates and their promotions, the second being the incumbent now, so the
 * first can be reinstated.
 */
export async function seedPromotionHistory(
  db: Db,
  routine: RoutineRow,
  authorId: number,
  maintainerId: number,
): Promise<{ first: number; second: number }> {
  const ids: number[] = [];
  let previous: number | null = null;
  for (let i = 0; i < 2; i++) {
    const seeded = await seedCandidate(db, routine, authorId, 'promoted');
    const [promotion] = await db
      .insert(promotions)
      .values({
        routineId: routine.id,
        revisionId: seeded.revisionId,
        trialId: seeded.trialId,
        previousRevisionId: previous,
        kind: 'promote',
        promotedBy: maintainerId,
        note: `promotion ${i + 1}`,
        metricsSnapshot: { worstFactorRatio: 1.7, worstForwardErrorOverBound: 0.2, timing: [] },
      })
      .returning();
    await db
      .update(routines)
      .set({ incumbentRevisionId: seeded.revisionId })
      .where(eq(routines.id, routine.id));
    previous = seeded.revisionId;
    ids.push(promotion!.id);
  }
  return { first: ids[0]!, second: ids[1]! };
}
