import type { CreateReview, ReviewOutcome } from '@shared/api/reviews.ts';
import { recordAudit } from '@server/audit/audit.ts';
import type { CurrentUser } from '@server/auth/current-user.ts';
import type { Env } from '@server/config/env.ts';
import type { Db } from '@server/db/client.ts';
import { AppError } from '@server/http/errors.ts';
import { candidateAccess } from '@server/candidates/candidate-access.ts';
import { candidateMailContext } from '@server/candidates/candidate-mail.ts';
import { moveCandidate } from '@server/candidates/candidate-moves.ts';
import { lockCandidate } from '@server/candidates/candidates.repo.ts';
import { clearanceOf } from '@server/candidates/clearance.ts';
import { contactOf, teamAddresses } from '@server/candidates/team-recipients.repo.ts';
import {
  clearedEmail,
  sentBackEmail,
  signedOffEmail,
} from '@server/mail/messages/review-emails.ts';
import { enqueueEmail } from '@server/mail/outbox.ts';
import { latestRevisionOf } from '@server/revisions/revisions.repo.ts';
import { toReview } from './review-mapping.ts';
import { reviewRefusal } from './reviews.policy.ts';
import { findReview, hasSignedOff, insertReview } from './reviews.repo.ts';

/**
 * A reviewer's verdict on the candidate's latest revision, while it is in review or cleared.
 * A send-back returns the candidate to its author with the reason. A sign-off tells the author
 * and, when the candidate now meets the bar (clearance.ts), clears it and tells the team's
 * maintainers. State, audit and e-mail commit together.
 */
export async function submitReview(
  db: Db,
  env: Env,
  user: CurrentUser,
  candidateId: number,
  input: CreateReview,
): Promise<ReviewOutcome> {
  const { candidate, routine, role } = await candidateAccess(db, user, candidateId);
  const refusal = reviewRefusal(user, role, candidate);
  if (refusal) throw new AppError('forbidden', refusal);

  const outcome = await db.transaction(async (tx) => {
    let current = await lockCandidate(tx, candidateId);
    if (current.state !== 'in-review' && current.state !== 'cleared') {
      throw new AppError(
        'conflict',
        `Only a candidate in review or cleared takes a verdict; this one is ${current.state.replace('-', ' ')}.`,
      );
    }
    const revision = await latestRevisionOf(tx, candidateId);
    if (input.verdict === 'sign-off' && (await hasSignedOff(tx, revision.id, user.id))) {
      throw new AppError('conflict', `You already signed off revision ${revision.number}.`);
    }
    const review = await insertReview(tx, {
      candidateId,
      revisionId: revision.id,
      reviewerId: user.id,
      verdict: input.verdict,
      body: input.body,
    });
    const mail = await candidateMailContext(tx, routine, current, revision.number);
    const reviewerName = (await contactOf(tx, user.id)).name;
    const move = { actorId: user.id, teamId: routine.teamId };
    const details = { reviewId: review.id, revision: revision.number };
    // The verdict itself is a change of record even when it moves nothing (a first of two
    // sign-offs); the candidate's moves below are audited as well, by moveCandidate.
    await recordAudit(tx, {
      ...move,
      action: input.verdict === 'sign-off' ? 'review.signed-off' : 'review.sent-back',
      entity: 'review',
      entityId: review.id,
      details: { candidateId, revision: revision.number },
    });

    if (input.verdict === 'send-back') {
      current = await moveCandidate(tx, {
        ...move,
        candidate: current,
        to: 'returned',
        action: 'candidate.sent-back',
        details,
      });
      const email = sentBackEmail(env, { ...mail.ref, reviewerName, reason: input.body });
      await enqueueEmail(tx, { kind: 'sent-back', to: mail.author.email ?? [], ...email });
      const clearance = await clearanceOf(tx, current, routine);
      return { reviewId: review.id, state: current.state, clearance };
    }

    const clearance = await clearanceOf(tx, current, routine);
    const signedOff = signedOffEmail(env, {
      ...mail.ref,
      reviewerName,
      signOffs: clearance.signOffs,
      signOffsNeeded: clearance.signOffsRequired,
    });
    await enqueueEmail(tx, { kind: 'signed-off', to: mail.author.email ?? [], ...signedOff });
    if (clearance.cleared && current.state === 'in-review') {
      current = await moveCandidate(tx, {
        ...move,
        candidate: current,
        to: 'cleared',
        action: 'candidate.cleared',
        details,
      });
      const maintainers = await teamAddresses(tx, routine.teamId, ['maintainer']);
      const cleared = clearedEmail(env, { ...mail.ref, authorName: mail.author.name });
      await enqueueEmail(tx, { kind: 'cleared', to: maintainers, ...cleared });
    }
    return { reviewId: review.id, state: current.state, clearance };
  });

  return {
    review: toReview((await findReview(db, outcome.reviewId))!),
    candidateState: outcome.state,
    signOffs: outcome.clearance.signOffs,
    signOffsRequired: outcome.clearance.signOffsRequired,
  };
}
