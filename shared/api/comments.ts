import { z } from 'zod';
import { pageSchema } from '@shared/api/pagination.ts';
import { bodyIdSchema, personSchema } from '@shared/api/revisions.ts';

/**
 * `POST /api/candidates/:id/comments`: a general comment, a comment on a revision, or a comment on
 * one line of a revision (a line needs the revision, and must exist in its source).
 */
export const createCommentSchema = z
  .object({
    body: z.string().trim().min(1, 'write something').max(20_000),
    revisionId: bodyIdSchema.optional(),
    line: z.number().int().min(1).optional(),
  })
  .refine((c) => c.line === undefined || c.revisionId !== undefined, {
    message: 'a line comment needs the revision it is on',
    path: ['revisionId'],
  });
export type CreateComment = z.infer<typeof createCommentSchema>;

export const commentSchema = z.object({
  id: z.number().int().positive(),
  candidateId: z.number().int().positive(),
  revisionId: z.number().int().positive().nullable(),
  /** The revision's number, when the comment is on a revision. */
  revisionNumber: z.number().int().positive().nullable(),
  line: z.number().int().positive().nullable(),
  author: personSchema,
  body: z.string(),
  createdAt: z.iso.datetime({ offset: true }),
});
export type Comment = z.infer<typeof commentSchema>;

/** `GET /api/candidates/:id/comments`, oldest first (a conversation reads downwards). */
export const commentPageSchema = pageSchema(commentSchema);
export type CommentPage = z.infer<typeof commentPageSchema>;
