import { z } from 'zod';
import { pageSchema, paginationQuerySchema } from '@shared/api/pagination.ts';
import {
  kernelSourceSchema,
  personSchema,
  revisionSchema,
  revisionSummarySchema,
} from '@shared/api/revisions.ts';
import { reviewSchema } from '@shared/api/reviews.ts';
import { trialSummarySchema } from '@shared/api/trials.ts';
import { teamRoleSchema } from '@shared/roles.ts';
import { routineSlugSchema } from '@shared/routines.ts';
import { candidateStateSchema } from '@shared/states.ts';

/** `GET /api/routines/:id/candidates?state&limit&offset`, newest first. */
export const listCandidatesQuerySchema = paginationQuerySchema.extend({
  state: candidateStateSchema.optional(),
});
export type ListCandidatesQuery = z.infer<typeof listCandidatesQuerySchema>;

/**
 * `POST /api/routines/:id/candidates`: JSON, or multipart with text fields `title` and
 * `description` and a `.ts` file field `source` (at most 200 kB).
 */
export const createCandidateSchema = z.object({
  title: z.string().trim().min(1, 'give the candidate a title').max(200),
  description: z.string().trim().max(20_000).default(''),
  source: kernelSourceSchema,
});
export type CreateCandidate = z.infer<typeof createCandidateSchema>;

/** A candidate as listed. */
export const candidateSummarySchema = z.object({
  id: z.number().int().positive(),
  routineId: z.number().int().positive(),
  title: z.string(),
  state: candidateStateSchema,
  author: personSchema,
  /** The number of its newest revision. */
  latestRevision: z.number().int().positive(),
  createdAt: z.iso.datetime({ offset: true }),
  updatedAt: z.iso.datetime({ offset: true }),
});
export type CandidateSummary = z.infer<typeof candidateSummarySchema>;

export const candidatePageSchema = pageSchema(candidateSummarySchema);
export type CandidatePage = z.infer<typeof candidatePageSchema>;

/** How far the candidate is from `cleared`, judged on its latest revision only. */
export const clearanceSchema = z.object({
  /** The latest revision's latest trial completed and passed the acceptance policy. */
  trialPassed: z.boolean(),
  /** Distinct reviewers who signed off the latest revision. */
  signOffs: z.number().int().min(0),
  signOffsRequired: z.number().int().min(1),
  /** What is still missing, in plain words; empty when cleared (or past it). */
  stillNeeded: z.array(z.string()),
});
export type Clearance = z.infer<typeof clearanceSchema>;

/** What the caller may do with this candidate now (so clients show only live buttons). */
export const candidatePermissionsSchema = z.object({
  role: teamRoleSchema,
  revise: z.boolean(),
  withdraw: z.boolean(),
  review: z.boolean(),
  promote: z.boolean(),
});

/** `GET /api/candidates/:id`. */
export const candidateDetailSchema = candidateSummarySchema.extend({
  description: z.string(),
  routine: z.object({
    id: z.number().int().positive(),
    teamId: z.number().int().positive(),
    title: z.string(),
    contract: routineSlugSchema,
    incumbentRevisionId: z.number().int().positive().nullable(),
  }),
  /** Oldest first. */
  revisions: z.array(revisionSummarySchema),
  /** The latest trial of the latest revision, or null when it has none (type errors). */
  latestTrial: trialSummarySchema.nullable(),
  /** Every verdict on every revision, oldest first. */
  reviews: z.array(reviewSchema),
  clearance: clearanceSchema,
  permissions: candidatePermissionsSchema,
});
export type CandidateDetail = z.infer<typeof candidateDetailSchema>;

/**
 * The answer to submitting a candidate or a revision (201): the candidate as it is now, the new
 * revision with its type-check diagnostics, and the queued trial (null when type errors kept it
 * from running; the candidate is then `trial-failed`).
 */
export const submissionSchema = z.object({
  candidate: candidateSummarySchema,
  revision: revisionSchema,
  trial: trialSummarySchema.nullable(),
});
export type Submission = z.infer<typeof submissionSchema>;
