import { z } from 'zod';
import { bodyIdSchema, personSchema } from '@shared/api/revisions.ts';
import { promotionKinds } from '@shared/states.ts';

/** `POST /api/candidates/:id/promote`. */
export const promoteSchema = z.object({
  note: z.string().trim().max(5_000).default(''),
});
export type Promote = z.infer<typeof promoteSchema>;

/** `POST /api/routines/:id/reinstate`: make an earlier promotion's revision the incumbent again. */
export const reinstateSchema = z.object({
  promotionId: bodyIdSchema,
  note: z.string().trim().max(5_000).default(''),
});
export type Reinstate = z.infer<typeof reinstateSchema>;

/**
 * Metrics kept with a promotion, computed from its trial's candidate results: the worst factor
 * ratio (solve residual ratio for back substitution) over the matrices that must factor, the
 * worst forward error over its bound where the reference is trusted, and per timing size the
 * median time and GFLOP/s. Null where nothing applies or the value was not finite.
 */
export const metricsSnapshotSchema = z.object({
  worstFactorRatio: z.number().nullable(),
  worstForwardErrorOverBound: z.number().nullable(),
  timing: z.array(
    z.object({
      n: z.number().int(),
      medianMs: z.number().nullable(),
      gflops: z.number().nullable(),
    }),
  ),
});
export type MetricsSnapshotShape = z.infer<typeof metricsSnapshotSchema>;

export const promotionSchema = z.object({
  id: z.number().int().positive(),
  routineId: z.number().int().positive(),
  kind: z.enum(promotionKinds),
  revisionId: z.number().int().positive(),
  revisionNumber: z.number().int().positive(),
  candidateId: z.number().int().positive(),
  candidateTitle: z.string(),
  /** The trial whose evidence the promotion rests on. */
  trialId: z.number().int().positive(),
  previousRevisionId: z.number().int().positive().nullable(),
  promotedBy: personSchema,
  note: z.string(),
  metricsSnapshot: metricsSnapshotSchema,
  createdAt: z.iso.datetime({ offset: true }),
});
export type Promotion = z.infer<typeof promotionSchema>;

/** The answer to promote and reinstate (201), with the safety caution clients must show. */
export const promotionOutcomeSchema = z.object({
  promotion: promotionSchema,
  caution: z.string(),
});
export type PromotionOutcome = z.infer<typeof promotionOutcomeSchema>;
