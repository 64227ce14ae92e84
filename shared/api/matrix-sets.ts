import { z } from 'zod';
import { pageSchema } from '@shared/api/pagination.ts';

/** The largest matrix order the engine generates (sandbox/matrices/generate.ts, MAX_ORDER). */
export const maxMatrixOrder = 4096;

const bodyIdSchema = z.number().int().positive().max(2_147_483_647);
const orderSchema = z.number().int().min(1).max(maxMatrixOrder);

/**
 * A generated matrix: a family recipe. The server checks the family, the size and the
 * parameters with the engine (each family has its own rules) and stores the recipe with every
 * default filled in, so the same matrix is built on every run.
 */
export const generatedItemInputSchema = z.strictObject({
  kind: z.literal('generated'),
  family: z.string().min(1).max(64),
  n: orderSchema,
  m: z
    .number()
    .int()
    .min(1)
    .max(4 * maxMatrixOrder)
    .optional(),
  seed: z.number().int().min(0).max(0xffffffff).optional(),
  params: z.record(z.string().max(64), z.number().finite()).optional(),
});

/** An uploaded Matrix Market file of the same team. */
export const uploadItemInputSchema = z.strictObject({
  kind: z.literal('upload'),
  uploadId: bodyIdSchema,
});

export const matrixSetItemInputSchema = z.discriminatedUnion('kind', [
  generatedItemInputSchema,
  uploadItemInputSchema,
]);
export type MatrixSetItemInput = z.infer<typeof matrixSetItemInputSchema>;

/** `POST /api/teams/:teamId/matrix-sets` and `PUT /api/matrix-sets/:id` (a whole new version). */
export const matrixSetInputSchema = z.strictObject({
  name: z.string().trim().min(1, 'give the set a name').max(100),
  description: z.string().trim().max(2_000).default(''),
  /** Orders at which timing runs, each once. */
  timingSizes: z
    .array(orderSchema)
    .min(1)
    .max(8)
    .refine((s) => new Set(s).size === s.length, 'list each timing size once'),
  items: z.array(matrixSetItemInputSchema).min(1).max(200),
});
export type MatrixSetInput = z.infer<typeof matrixSetInputSchema>;

/** A matrix set as listed. */
export const matrixSetSummarySchema = z.object({
  id: z.number().int().positive(),
  teamId: z.number().int().positive(),
  name: z.string(),
  description: z.string(),
  timingSizes: z.array(z.number().int().positive()),
  itemCount: z.number().int().min(0),
  /** Routines whose trials run on this set now. */
  routineCount: z.number().int().min(0),
  createdAt: z.iso.datetime({ offset: true }),
  updatedAt: z.iso.datetime({ offset: true }),
});
export type MatrixSetSummary = z.infer<typeof matrixSetSummarySchema>;

/** `GET /api/teams/:teamId/matrix-sets`, by name. */
export const matrixSetPageSchema = pageSchema(matrixSetSummarySchema);
export type MatrixSetPage = z.infer<typeof matrixSetPageSchema>;

/** One matrix of a set as stored, with what it is in one line. */
export const matrixSetItemSchema = z.object({
  position: z.number().int().min(0),
  kind: z.enum(['generated', 'upload']),
  /** Generated items: the recipe with its defaults filled in; null for files. */
  family: z.string().nullable(),
  n: z.number().int().positive().nullable(),
  m: z.number().int().positive().nullable(),
  seed: z.number().int().min(0).nullable(),
  params: z.record(z.string(), z.number()).nullable(),
  /** Uploaded items: the file; null for generated ones. */
  uploadId: z.number().int().positive().nullable(),
  fileName: z.string().nullable(),
  rows: z.number().int().positive(),
  cols: z.number().int().positive(),
  /** Stored entries: rows×cols for a generated (dense) matrix, the file's count for a file. */
  entries: z.number().int().min(0),
  symmetry: z.string(),
  /** e.g. `hilbert, 8×8, 64 entries, symmetric` or `frame.mtx, 5×5, 13 entries, symmetric`. */
  description: z.string(),
});
export type MatrixSetItem = z.infer<typeof matrixSetItemSchema>;

/** `GET /api/matrix-sets/:id`. */
export const matrixSetDetailSchema = matrixSetSummarySchema.extend({
  items: z.array(matrixSetItemSchema),
  routines: z.array(z.object({ id: z.number().int().positive(), title: z.string() })),
});
export type MatrixSetDetail = z.infer<typeof matrixSetDetailSchema>;
