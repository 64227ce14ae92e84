import type { Review } from '@shared/api/reviews.ts';
import type { ReviewListRow } from './reviews.repo.ts';

export function toReview({ review, revisionNumber, reviewer }: ReviewListRow): Review {
  return {
    id: review.id,
    candidateId: review.candidateId,
    revisionId: review.revisionId,
    revisionNumber,
    reviewer,
    verdict: review.verdict,
    body: review.body,
    createdAt: review.createdAt.toISOString(),
  };
}
