import type {
  CandidateDetail,
  CandidatePage,
  CandidateSummary,
  CreateCandidate,
  ListCandidatesQuery,
  Submission,
} from '@shared/api/candidates.ts';
import type { CurrentUser } from '@server/auth/current-user.ts';
import type { Db } from '@server/db/client.ts';
import { checkSubmittedKernel } from '@server/kernel-check/kernel-check-pool.ts';
import type { TrialQueue } from '@server/jobs/trial-queue.ts';
import { recordRevision } from '@server/revisions/revision-submission.ts';
import { finishSubmission } from '@server/revisions/revisions.service.ts';
import { candidateAccess, routineAccess } from './candidate-access.ts';
import { describeCandidate } from './candidate-detail.ts';
import { toCandidateSummary } from './candidate-mapping.ts';
import { moveCandidate } from './candidate-moves.ts';
import { requireWithdraw } from './candidates.policy.ts';
import {
  findCandidateSummary,
  insertCandidate,
  listCandidateRows,
  lockCandidate,
} from './candidates.repo.ts';

/** A page of a routine's candidates, most recently changed first, optionally in one state. */
export async function listCandidates(
  db: Db,
  user: CurrentUser,
  routineId: number,
  query: ListCandidatesQuery,
): Promise<CandidatePage> {
  await routineAccess(db, user, routineId);
  const { rows, total } = await listCandidateRows(db, routineId, query);
  return { items: rows.map(toCandidateSummary), total, limit: query.limit, offset: query.offset };
}

/**
 * A new candidate with revision 1, type-checked against the routine's contract. Without type
 * errors it goes on trial (the trial is queued after commit); with them it is trial-failed,
 * and the answer carries the diagnostics either way so the author sees them at once. Every
 * member of the team may submit.
 */
export async function createCandidate(
  db: Db,
  queue: TrialQueue | undefined,
  user: CurrentUser,
  routineId: number,
  input: CreateCandidate,
): Promise<Submission> {
  const { routine } = await routineAccess(db, user, routineId);
  const { diagnostics, checkedWith } = await checkSubmittedKernel(input.source, routine.contract);
  const submitted = await db.transaction(async (tx) => {
    const candidate = await insertCandidate(tx, {
      routineId,
      authorId: user.id,
      title: input.title,
      description: input.description,
    });
    return recordRevision(tx, {
      routine,
      candidate,
      actorId: user.id,
      source: input.source,
      diagnostics,
      checkedWith,
      action: 'candidate.submitted',
    });
  });
  return finishSubmission(db, queue, submitted);
}

export async function getCandidate(
  db: Db,
  user: CurrentUser,
  id: number,
): Promise<CandidateDetail> {
  return describeCandidate(db, user, await candidateAccess(db, user, id));
}

/** The author (or a maintainer) withdraws a candidate; promoted and withdrawn ones stay. */
export async function withdrawCandidate(
  db: Db,
  user: CurrentUser,
  id: number,
): Promise<CandidateSummary> {
  const { candidate, routine, role } = await candidateAccess(db, user, id);
  requireWithdraw(user, role, candidate);
  await db.transaction(async (tx) => {
    await moveCandidate(tx, {
      candidate: await lockCandidate(tx, id),
      to: 'withdrawn',
      actorId: user.id,
      teamId: routine.teamId,
      action: 'candidate.withdrawn',
    });
  });
  return toCandidateSummary((await findCandidateSummary(db, id))!);
}
