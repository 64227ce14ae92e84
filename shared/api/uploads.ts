import { z } from 'zod';
import { pageSchema } from '@shared/api/pagination.ts';

/** The largest Matrix Market file accepted, in bytes (8 MiB). */
export const maxUploadBytes = 8 * 1024 * 1024;

/** What parsing found in a Matrix Market file (the answer to a preview). */
export const matrixMarketSummarySchema = z.object({
  fileName: z.string(),
  bytes: z.number().int().min(0),
  rows: z.number().int().positive(),
  cols: z.number().int().positive(),
  entries: z.number().int().min(0),
  symmetry: z.enum(['general', 'symmetric', 'skew-symmetric']),
  field: z.enum(['real', 'integer', 'pattern']),
  format: z.enum(['coordinate', 'array']),
});
export type MatrixMarketSummary = z.infer<typeof matrixMarketSummarySchema>;

/** A stored upload as listed: never its content. */
export const uploadSchema = matrixMarketSummarySchema.extend({
  id: z.number().int().positive(),
  teamId: z.number().int().positive(),
  uploadedBy: z.object({ id: z.number().int().positive(), login: z.string() }),
  createdAt: z.iso.datetime({ offset: true }),
});
export type Upload = z.infer<typeof uploadSchema>;

/** `GET /api/teams/:teamId/uploads`, newest first. */
export const uploadPageSchema = pageSchema(uploadSchema);
export type UploadPage = z.infer<typeof uploadPageSchema>;

/** Details of a `validation-failed` answer to a file that does not parse. */
export const matrixMarketProblemSchema = z.object({
  line: z.number().int().positive(),
  reason: z.string(),
  code: z.string(),
});
export type MatrixMarketProblem = z.infer<typeof matrixMarketProblemSchema>;
