import { loadEnv, type Env } from '@server/config/env.ts';
import { candidateMailContext } from '@server/candidates/candidate-mail.ts';
import { findCandidate, findRoutine } from '@server/candidates/candidates.repo.ts';
import { teamAddresses } from '@server/candidates/team-recipients.repo.ts';
import { awaitsReviewEmail } from '@server/mail/messages/review-emails.ts';
import { enqueueEmail } from '@server/mail/outbox.ts';
import type { DbOrTx } from '@server/mail/outbox.repo.ts';
import { findRevision } from '@server/revisions/revisions.repo.ts';
import { findTrial } from './trials.repo.ts';

/**
 * The worker calls this in the transaction that writes a finished trial's results and moves
 * its candidate on. When a candidate's trial completed and the candidate is now in review, the
 * team's reviewers (not the author) get "awaits review" through the outbox, so the message
 * commits with the results or not at all. Drift-check trials and failed trials send nothing
 * from here. Returns the outbox rows queued.
 */
export async function notifyTrialFinished(
  tx: DbOrTx,
  trialId: number,
  env: Env = loadEnv(),
): Promise<number[]> {
  const found = await findTrial(tx, trialId);
  if (!found || found.trial.purpose !== 'candidate' || found.trial.status !== 'completed') {
    return [];
  }
  const candidate = await findCandidate(tx, found.candidateId);
  const routine = await findRoutine(tx, found.trial.routineId);
  const revision = await findRevision(tx, found.trial.revisionId);
  if (!candidate || !routine || !revision || candidate.state !== 'in-review') return [];
  const mail = await candidateMailContext(tx, routine, candidate, revision.revision.number);
  const reviewers = await teamAddresses(tx, routine.teamId, ['reviewer'], candidate.authorId);
  const email = awaitsReviewEmail(env, { ...mail.ref, authorName: mail.author.name });
  return enqueueEmail(tx, { kind: 'awaits-review', to: reviewers, ...email });
}
