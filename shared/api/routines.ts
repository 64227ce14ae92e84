import { z } from 'zod';
import { acceptancePolicySchema, type AcceptancePolicy } from '@shared/acceptance-policy.ts';
import { pageSchema } from '@shared/api/pagination.ts';
import { slugSchema } from '@shared/api/params.ts';
import { teamRoleSchema } from '@shared/roles.ts';
import { routineSlugSchema } from '@shared/routines.ts';

/** An id inside a JSON body: a number, not a string of digits. */
const bodyIdSchema = z.number().int().positive().max(2_147_483_647);

/** Candidate states still in play (not promoted, not withdrawn), counted per routine. */
export const openCandidateStates = [
  'drafting',
  'on-trial',
  'in-review',
  'cleared',
  'returned',
  'trial-failed',
] as const;
export const openCandidateCountsSchema = z.object({
  drafting: z.number().int().min(0),
  'on-trial': z.number().int().min(0),
  'in-review': z.number().int().min(0),
  cleared: z.number().int().min(0),
  returned: z.number().int().min(0),
  'trial-failed': z.number().int().min(0),
});
export type OpenCandidateCounts = z.infer<typeof openCandidateCountsSchema>;

/**
 * The incumbent's headline figures, from the trial it was promoted on (the promotion's metrics
 * snapshot): the worst factor ratio, and the median time at the largest timing size.
 */
export const incumbentHeadlineSchema = z.object({
  worstFactorRatio: z.number().nullable(),
  timingN: z.number().int().positive().nullable(),
  timingMedianMs: z.number().nullable(),
});
export type IncumbentHeadline = z.infer<typeof incumbentHeadlineSchema>;

/** A routine as listed on its team's page. */
export const routineSummarySchema = z.object({
  id: z.number().int().positive(),
  teamId: z.number().int().positive(),
  slug: z.string(),
  title: z.string(),
  contract: routineSlugSchema,
  matrixSetId: z.number().int().positive(),
  incumbentRevisionId: z.number().int().positive().nullable(),
  /** The incumbent's candidate and revision; null while the routine has no incumbent. */
  incumbent: z
    .object({
      candidateId: z.number().int().positive(),
      candidateTitle: z.string(),
      revisionNumber: z.number().int().positive(),
    })
    .nullable(),
  /** Null while the routine has no incumbent. */
  headline: incumbentHeadlineSchema.nullable(),
  openCandidates: openCandidateCountsSchema,
});
export type RoutineSummary = z.infer<typeof routineSummarySchema>;

/** `GET /api/teams/:teamId/routines`, by title. */
export const routinePageSchema = pageSchema(routineSummarySchema);
export type RoutinePage = z.infer<typeof routinePageSchema>;

/** `POST /api/teams/:teamId/routines`: the policy may be partial; defaults fill the rest. */
export const createRoutineSchema = z.strictObject({
  slug: slugSchema,
  title: z.string().trim().min(1, 'give the routine a title').max(200),
  description: z.string().trim().max(20_000).default(''),
  contract: routineSlugSchema,
  policy: acceptancePolicySchema.prefault({}),
  matrixSetId: bodyIdSchema,
});
export type CreateRoutine = z.infer<typeof createRoutineSchema>;

const policy = acceptancePolicySchema.shape;

/** Changes to an acceptance policy: only the named thresholds change, no defaults applied. */
export const policyChangesSchema = z.strictObject({
  maxFactorRatio: policy.maxFactorRatio.removeDefault().optional(),
  requireRejections: policy.requireRejections.removeDefault().optional(),
  maxAccuracyLossFactor: policy.maxAccuracyLossFactor.removeDefault().optional(),
  allowedSlowdown: policy.allowedSlowdown.removeDefault().optional(),
  timingMargin: policy.timingMargin.removeDefault().optional(),
  signOffsRequired: policy.signOffsRequired.removeDefault().optional(),
} satisfies Record<keyof AcceptancePolicy, z.ZodType>);
export type PolicyChanges = z.infer<typeof policyChangesSchema>;

/** `PATCH /api/routines/:id`: at least one field; `policy` changes only the thresholds named. */
export const updateRoutineSchema = z
  .strictObject({
    title: z.string().trim().min(1).max(200).optional(),
    description: z.string().trim().max(20_000).optional(),
    policy: policyChangesSchema.optional(),
    matrixSetId: bodyIdSchema.optional(),
  })
  .refine((v) => Object.values(v).some((x) => x !== undefined), 'change at least one field');
export type UpdateRoutine = z.infer<typeof updateRoutineSchema>;

/** The incumbent of a routine, with who promoted it and when. */
export const routineIncumbentSchema = z.object({
  revisionId: z.number().int().positive(),
  revisionNumber: z.number().int().positive(),
  candidateId: z.number().int().positive(),
  candidateTitle: z.string(),
  /** Null only for an incumbent set without a promotion record. */
  promotion: z
    .object({
      id: z.number().int().positive(),
      trialId: z.number().int().positive(),
      promotedBy: z.object({ id: z.number().int().positive(), login: z.string() }),
      promotedAt: z.iso.datetime({ offset: true }),
      headline: incumbentHeadlineSchema,
    })
    .nullable(),
});
export type RoutineIncumbent = z.infer<typeof routineIncumbentSchema>;

/** `GET /api/routines/:id`: everything an author needs to start a kernel. */
export const routineDetailSchema = routineSummarySchema.extend({
  description: z.string(),
  myRole: teamRoleSchema,
  /** The contract as TypeScript declarations (the typings the editor shows). */
  contractText: z.string(),
  /** A plain, correct kernel to begin from. */
  starterSource: z.string(),
  policy: acceptancePolicySchema,
  matrixSet: z.object({
    id: z.number().int().positive(),
    name: z.string(),
    description: z.string(),
    itemCount: z.number().int().min(0),
    timingSizes: z.array(z.number().int().positive()),
  }),
  incumbent: routineIncumbentSchema.nullable(),
  createdAt: z.iso.datetime({ offset: true }),
});
export type RoutineDetail = z.infer<typeof routineDetailSchema>;
