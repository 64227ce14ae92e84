import { desc, eq, sql } from 'drizzle-orm';
import { recordAudit } from '@server/audit/audit.ts';
import { candidates } from '@server/db/schema/candidates.ts';
import { revisions } from '@server/db/schema/revisions.ts';
import { routines } from '@server/db/schema/routines.ts';
import type { DbOrTx } from '@server/mail/outbox.repo.ts';
import type { FinishedTrial } from './finished-trial.ts';

/**
 * Moves the candidate of a finished candidate trial on: on trial → in review when the trial
 * completed (whatever its verdict: reviewers judge the evidence), on trial → trial failed when
 * it could not run or errored (so the author can submit a new revision). Only when the
 * candidate is still on trial and this trial's revision is still its latest; a candidate that
 * was withdrawn or revised meanwhile stays as it is. The move is audited with no actor (the
 * worker made it). Returns the new state, or null when nothing moved.
 */
export async function moveCandidateAfterTrial(
  tx: DbOrTx,
  finished: FinishedTrial,
): Promise<'in-review' | 'trial-failed' | null> {
  const { trial } = finished;
  if (trial.purpose !== 'candidate') return null;
  const [revision] = await tx
    .select({ candidateId: revisions.candidateId })
    .from(revisions)
    .where(eq(revisions.id, trial.revisionId));
  if (!revision) return null;
  const [candidate] = await tx
    .select()
    .from(candidates)
    .where(eq(candidates.id, revision.candidateId))
    .for('update');
  if (!candidate || candidate.state !== 'on-trial') return null;
  const [latest] = await tx
    .select({ id: revisions.id })
    .from(revisions)
    .where(eq(revisions.candidateId, candidate.id))
    .orderBy(desc(revisions.number))
    .limit(1);
  if (latest?.id !== trial.revisionId) return null;

  const to = finished.status === 'completed' ? 'in-review' : 'trial-failed';
  await tx
    .update(candidates)
    .set({ state: to, updatedAt: sql`now()` })
    .where(eq(candidates.id, candidate.id));
  const [routine] = await tx
    .select({ teamId: routines.teamId })
    .from(routines)
    .where(eq(routines.id, trial.routineId));
  await recordAudit(tx, {
    actorId: null,
    teamId: routine?.teamId ?? null,
    action: to === 'in-review' ? 'candidate.trial-completed' : 'candidate.trial-failed',
    entity: 'candidate',
    entityId: candidate.id,
    details: { from: candidate.state, to, trialId: trial.id, trialStatus: finished.status },
  });
  return to;
}
