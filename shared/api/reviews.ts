import { z } from 'zod';
import { personSchema } from '@shared/api/revisions.ts';
import { candidateStateSchema, reviewVerdictSchema } from '@shared/states.ts';

/**
 * `POST /api/candidates/:id/reviews`: a verdict on the candidate's latest revision. A send-back
 * needs a reason; a sign-off may carry a remark.
 */
export const createReviewSchema = z.discriminatedUnion('verdict', [
  z.object({
    verdict: z.literal('sign-off'),
    body: z.string().trim().max(20_000).default(''),
  }),
  z.object({
    verdict: z.literal('send-back'),
    body: z
      .string({ error: 'say why the candidate is sent back' })
      .trim()
      .min(1, 'say why the candidate is sent back')
      .max(20_000),
  }),
]);
export type CreateReview = z.infer<typeof createReviewSchema>;

export const reviewSchema = z.object({
  id: z.number().int().positive(),
  candidateId: z.number().int().positive(),
  revisionId: z.number().int().positive(),
  revisionNumber: z.number().int().positive(),
  reviewer: personSchema,
  verdict: reviewVerdictSchema,
  body: z.string(),
  createdAt: z.iso.datetime({ offset: true }),
});
export type Review = z.infer<typeof reviewSchema>;

/** The answer to a verdict (201): the review and the candidate's state after it. */
export const reviewOutcomeSchema = z.object({
  review: reviewSchema,
  candidateState: candidateStateSchema,
  signOffs: z.number().int().min(0),
  signOffsRequired: z.number().int().min(1),
});
export type ReviewOutcome = z.infer<typeof reviewOutcomeSchema>;
