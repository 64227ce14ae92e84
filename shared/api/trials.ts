import { z } from 'zod';
import { pageSchema } from '@shared/api/pagination.ts';
import { trialPurposeSchema, trialStatusSchema } from '@shared/states.ts';
import {
  machineSchema,
  matrixReportSchema,
  phaseTimesSchema,
  timingReportSchema,
  trialReportSchema,
} from '@shared/trial-report.ts';

/** Where a trial is: the phase, and how far through it. */
export const trialProgressSchema = z.object({
  phase: z.enum(['queued', 'compile', 'accuracy', 'timing', 'verdict', 'done']),
  done: z.number().int().min(0),
  total: z.number().int().min(0),
  label: z.string().optional(),
});
export type TrialProgress = z.infer<typeof trialProgressSchema>;

/** A trial without its results (lists, the candidate page, the live stream). */
export const trialSummarySchema = z.object({
  id: z.number().int().positive(),
  routineId: z.number().int().positive(),
  revisionId: z.number().int().positive(),
  candidateId: z.number().int().positive(),
  incumbentRevisionId: z.number().int().positive().nullable(),
  matrixSetId: z.number().int().positive(),
  purpose: trialPurposeSchema,
  status: trialStatusSchema,
  progress: trialProgressSchema,
  /** The policy verdict's overall answer; null until the trial completed. */
  passed: z.boolean().nullable(),
  message: z.string().nullable(),
  createdAt: z.iso.datetime({ offset: true }),
  startedAt: z.iso.datetime({ offset: true }).nullable(),
  finishedAt: z.iso.datetime({ offset: true }).nullable(),
});
export type TrialSummary = z.infer<typeof trialSummarySchema>;

/**
 * `GET /api/trials/:id`: the summary with the machine, phase times, policy verdict and the full
 * results, per matrix (candidate next to incumbent) and per timing size. Non-finite numbers
 * travel as the strings "Infinity", "-Infinity" and "NaN": parse the body with
 * `parseWithNonFinite` (shared/json-numbers.ts) before this schema.
 */
export const trialDetailSchema = trialSummarySchema.extend({
  attempts: z.number().int().min(0),
  machine: machineSchema.nullable(),
  phases: phaseTimesSchema.nullable(),
  verdict: trialReportSchema.shape.verdict.nullable(),
  matrices: z.array(matrixReportSchema),
  timing: z.array(timingReportSchema),
});
export type TrialDetail = z.infer<typeof trialDetailSchema>;

/** `GET /api/revisions/:id/trials`, newest first. */
export const trialPageSchema = pageSchema(trialSummarySchema);
export type TrialPage = z.infer<typeof trialPageSchema>;

/** Statuses after which a trial changes no more. */
export const finalTrialStatuses = ['completed', 'trial-failed', 'errored'] as const;

/**
 * `GET /api/trials/:id/events` sends server-sent events: `progress` whenever the status or
 * progress changes (the first at once), then one `finished` when the trial is over, and closes.
 * Both carry this data, as JSON.
 */
export const trialEventSchema = z.object({
  trialId: z.number().int().positive(),
  status: trialStatusSchema,
  progress: trialProgressSchema,
  passed: z.boolean().nullable(),
  message: z.string().nullable(),
});
export type TrialEvent = z.infer<typeof trialEventSchema>;
