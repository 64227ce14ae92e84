import { z } from 'zod';
import { promotionSchema } from '@shared/api/promotions.ts';
import { routineSlugSchema } from '@shared/routines.ts';
import { driftStatuses } from '@shared/states.ts';

/** One incumbent's time in office: from its promotion (or reinstatement) to the next one. */
export const tenureSchema = z.object({
  promotionId: z.number().int().positive(),
  revisionId: z.number().int().positive(),
  revisionNumber: z.number().int().positive(),
  candidateId: z.number().int().positive(),
  candidateTitle: z.string(),
  trialId: z.number().int().positive(),
  from: z.iso.datetime({ offset: true }),
  /** Null while it is the incumbent. */
  to: z.iso.datetime({ offset: true }).nullable(),
});
export type Tenure = z.infer<typeof tenureSchema>;

/** A scheduled re-run of the incumbent, compared with its promotion's snapshot. */
export const driftCheckSchema = z.object({
  id: z.number().int().positive(),
  promotionId: z.number().int().positive(),
  /** Null until its trial has been created. */
  trialId: z.number().int().positive().nullable(),
  /** Null while the check runs. */
  status: z.enum(driftStatuses).nullable(),
  findings: z.array(z.string()),
  summary: z.string().nullable(),
  alertOpen: z.boolean(),
  createdAt: z.iso.datetime({ offset: true }),
  finishedAt: z.iso.datetime({ offset: true }).nullable(),
});
export type DriftCheck = z.infer<typeof driftCheckSchema>;

/** `GET /api/routines/:id/logbook`: the routine's history, each list oldest first. */
export const logbookSchema = z.object({
  routine: z.object({
    id: z.number().int().positive(),
    teamId: z.number().int().positive(),
    title: z.string(),
    contract: routineSlugSchema,
    incumbentRevisionId: z.number().int().positive().nullable(),
  }),
  promotions: z.array(promotionSchema),
  tenures: z.array(tenureSchema),
  driftChecks: z.array(driftCheckSchema),
});
export type Logbook = z.infer<typeof logbookSchema>;
