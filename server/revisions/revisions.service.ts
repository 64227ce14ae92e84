import type { Submission } from '@shared/api/candidates.ts';
import type { CreateRevision, Revision } from '@shared/api/revisions.ts';
import type { CurrentUser } from '@server/auth/current-user.ts';
import type { Db } from '@server/db/client.ts';
import { checkSubmittedKernel } from '@server/kernel-check/kernel-check-pool.ts';
import { AppError } from '@server/http/errors.ts';
import type { TrialQueue } from '@server/jobs/trial-queue.ts';
import { candidateAccess } from '@server/candidates/candidate-access.ts';
import { toCandidateSummary } from '@server/candidates/candidate-mapping.ts';
import { requireRevise, revisableStates } from '@server/candidates/candidates.policy.ts';
import { findCandidateSummary, lockCandidate } from '@server/candidates/candidates.repo.ts';
import { toTrialSummary } from '@server/trials/trial-rows.ts';
import { revisionAccess } from './revision-access.ts';
import { toRevision } from './revision-mapping.ts';
import { recordRevision, type SubmittedRevision } from './revision-submission.ts';
import { findRevision } from './revisions.repo.ts';

/** One revision: its immutable source and what the contract check found. */
export async function getRevision(db: Db, user: CurrentUser, id: number): Promise<Revision> {
  return toRevision(await revisionAccess(db, user, id));
}

/** The answer to a submission, read after commit; the trial is enqueued first. */
export async function finishSubmission(
  db: Db,
  queue: TrialQueue | undefined,
  submitted: SubmittedRevision,
): Promise<Submission> {
  const { candidate, revision, trial } = submitted;
  if (trial && queue) await queue.enqueueTrial(trial.id);
  // In turn, not at once: the demo loader submits with its transaction as `db`, and a
  // transaction's one connection takes one query at a time (pg deprecates queueing them).
  const summary = await findCandidateSummary(db, candidate.id);
  const stored = await findRevision(db, revision.id);
  return {
    candidate: toCandidateSummary(summary!),
    revision: toRevision(stored!),
    trial: trial ? toTrialSummary(trial, candidate.id) : null,
  };
}

function notRevisable(state: string): AppError {
  return new AppError(
    'conflict',
    `A candidate that is ${state.replace('-', ' ')} takes no new revision` +
      (state === 'on-trial' ? ' until its trial has finished.' : '.'),
  );
}

/**
 * The author's new revision: type-checked against the routine's contract, stored, and put on
 * trial (or marked trial-failed when it has type errors). Allowed while drafting, returned,
 * trial-failed, in review or cleared; sign-offs on older revisions stop counting.
 */
export async function submitRevision(
  db: Db,
  queue: TrialQueue | undefined,
  user: CurrentUser,
  candidateId: number,
  input: CreateRevision,
): Promise<Submission> {
  const { candidate, routine } = await candidateAccess(db, user, candidateId);
  requireRevise(user, candidate);
  if (!revisableStates.includes(candidate.state)) throw notRevisable(candidate.state);
  const { diagnostics, checkedWith } = await checkSubmittedKernel(input.source, routine.contract);
  const submitted = await db.transaction(async (tx) => {
    const locked = await lockCandidate(tx, candidateId);
    if (!revisableStates.includes(locked.state)) throw notRevisable(locked.state);
    return recordRevision(tx, {
      routine,
      candidate: locked,
      actorId: user.id,
      source: input.source,
      diagnostics,
      checkedWith,
      action: 'candidate.revised',
    });
  });
  return finishSubmission(db, queue, submitted);
}
