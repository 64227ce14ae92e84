import { z } from 'zod';
import { kernelDiagnosticSchema } from '@shared/contracts/kernel-diagnostic.ts';

/** The largest kernel source accepted, in UTF-8 bytes (the engine's limit, 200 kB). */
export const maxKernelSourceBytes = 200_000;

const utf8Bytes = (s: string) => new TextEncoder().encode(s).length;

/** A kernel's TypeScript source: not blank, at most 200 kB. */
export const kernelSourceSchema = z
  .string()
  .refine((s) => s.trim() !== '', 'the kernel source is empty')
  .refine(
    (s) => utf8Bytes(s) <= maxKernelSourceBytes,
    `the kernel source may be at most ${maxKernelSourceBytes} bytes`,
  );

/** An id inside a JSON body: a number, not a string of digits. */
export const bodyIdSchema = z.number().int().positive().max(2_147_483_647);

/** Someone as the review process shows them. */
export const personSchema = z.object({
  id: z.number().int().positive(),
  login: z.string(),
  name: z.string().nullable(),
});
export type Person = z.infer<typeof personSchema>;

/** `POST /api/candidates/:id/revisions` (JSON, or multipart with a `.ts` file field `source`). */
export const createRevisionSchema = z.object({ source: kernelSourceSchema });
export type CreateRevision = z.infer<typeof createRevisionSchema>;

/** A revision as listed on its candidate: no source. */
export const revisionSummarySchema = z.object({
  id: z.number().int().positive(),
  candidateId: z.number().int().positive(),
  number: z.number().int().positive(),
  /** SHA-256 of the source, hex. */
  sourceHash: z.string(),
  /** How many type errors the contract check found (0 = it could run). */
  errorCount: z.number().int().min(0),
  createdBy: personSchema,
  createdAt: z.iso.datetime({ offset: true }),
});
export type RevisionSummary = z.infer<typeof revisionSummarySchema>;

/** `GET /api/revisions/:id`: the immutable source and what the contract check found. */
export const revisionSchema = revisionSummarySchema.extend({
  source: z.string(),
  diagnostics: z.array(kernelDiagnosticSchema),
});
export type Revision = z.infer<typeof revisionSchema>;
