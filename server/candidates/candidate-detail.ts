import type { CandidateDetail } from '@shared/api/candidates.ts';
import type { CurrentUser } from '@server/auth/current-user.ts';
import type { Db } from '@server/db/client.ts';
import { mayPromote } from '@server/promotions/promotions.policy.ts';
import { reviewRefusal } from '@server/reviews/reviews.policy.ts';
import { toReview } from '@server/reviews/review-mapping.ts';
import { reviewsOf } from '@server/reviews/reviews.repo.ts';
import { toRevisionSummary } from '@server/revisions/revision-mapping.ts';
import { revisionsOf } from '@server/revisions/revisions.repo.ts';
import { toTrialSummary } from '@server/trials/trial-rows.ts';
import type { CandidateAccess } from './candidate-access.ts';
import { toCandidateSummary } from './candidate-mapping.ts';
import { mayRevise, mayWithdraw, revisableStates } from './candidates.policy.ts';
import { findCandidateSummary } from './candidates.repo.ts';
import { clearanceOf } from './clearance.ts';
import { canMove } from './candidate-transitions.ts';

/**
 * Everything the candidate page shows: the candidate, its revisions, the latest trial of its
 * latest revision, every verdict, how far it is from cleared, and what the caller may do now.
 */
export async function describeCandidate(
  db: Db,
  user: CurrentUser,
  access: CandidateAccess,
): Promise<CandidateDetail> {
  const { candidate, routine, role } = access;
  const [summary, revisions, reviews, clearance] = await Promise.all([
    findCandidateSummary(db, candidate.id),
    revisionsOf(db, candidate.id),
    reviewsOf(db, candidate.id),
    clearanceOf(db, candidate, routine),
  ]);
  const { state } = candidate;
  return {
    ...toCandidateSummary(summary!),
    description: candidate.description,
    routine: {
      id: routine.id,
      teamId: routine.teamId,
      title: routine.title,
      contract: routine.contract,
      incumbentRevisionId: routine.incumbentRevisionId,
    },
    revisions: revisions.map(toRevisionSummary),
    latestTrial: clearance.latestTrial ? toTrialSummary(clearance.latestTrial, candidate.id) : null,
    reviews: reviews.map(toReview),
    clearance: {
      trialPassed: clearance.trialPassed,
      signOffs: clearance.signOffs,
      signOffsRequired: clearance.signOffsRequired,
      stillNeeded: clearance.stillNeeded,
    },
    permissions: {
      role,
      revise: mayRevise(user, candidate) && revisableStates.includes(state),
      withdraw: mayWithdraw(user, role, candidate) && canMove(state, 'withdrawn'),
      review:
        reviewRefusal(user, role, candidate) === null &&
        (state === 'in-review' || state === 'cleared'),
      promote: mayPromote(role) && state === 'cleared',
    },
  };
}
