import { queryOptions } from '@tanstack/react-query';
import { apiGet, apiSend } from '@client/api/api-client.ts';
import { commentPageSchema, commentSchema, type CreateComment } from '@shared/api/comments.ts';
import { reviewOutcomeSchema, type CreateReview } from '@shared/api/reviews.ts';

/** Query options for the review thread (the candidate and revisions come from candidateQueries). */
export const commentQueries = {
  all: (candidateId: number) => ['candidates', 'comments', candidateId] as const,
  list: (candidateId: number) =>
    queryOptions({
      queryKey: commentQueries.all(candidateId),
      queryFn: ({ signal }) =>
        apiGet(`/api/candidates/${candidateId}/comments?limit=100`, commentPageSchema, signal),
    }),
};

export const postComment = (candidateId: number, comment: CreateComment) =>
  apiSend('POST', `/api/candidates/${candidateId}/comments`, comment, commentSchema);

export const postReview = (candidateId: number, review: CreateReview) =>
  apiSend('POST', `/api/candidates/${candidateId}/reviews`, review, reviewOutcomeSchema);
