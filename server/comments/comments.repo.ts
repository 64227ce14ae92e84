import { asc, count, eq } from 'drizzle-orm';
import { comments } from '@server/db/schema/comments.ts';
import { revisions } from '@server/db/schema/revisions.ts';
import { users } from '@server/db/schema/users.ts';
import { personColumns, type PersonRow } from '@server/candidates/candidates.repo.ts';
import type { DbOrTx } from '@server/mail/outbox.repo.ts';

export type CommentRow = typeof comments.$inferSelect;

export interface CommentListRow {
  comment: CommentRow;
  revisionNumber: number | null;
  author: PersonRow;
}

function commentRows(db: DbOrTx) {
  return db
    .select({ comment: comments, revisionNumber: revisions.number, author: personColumns })
    .from(comments)
    .leftJoin(revisions, eq(revisions.id, comments.revisionId))
    .innerJoin(users, eq(users.id, comments.authorId));
}

/** A page of a candidate's comments, oldest first. */
export async function listCommentRows(
  db: DbOrTx,
  candidateId: number,
  page: { limit: number; offset: number },
): Promise<{ rows: CommentListRow[]; total: number }> {
  const where = eq(comments.candidateId, candidateId);
  const [rows, [totals]] = await Promise.all([
    commentRows(db)
      .where(where)
      .orderBy(asc(comments.createdAt), asc(comments.id))
      .limit(page.limit)
      .offset(page.offset),
    db.select({ total: count() }).from(comments).where(where),
  ]);
  return { rows, total: totals?.total ?? 0 };
}

export async function findComment(db: DbOrTx, id: number): Promise<CommentListRow | null> {
  const [row] = await commentRows(db).where(eq(comments.id, id)).limit(1);
  return row ?? null;
}

export async function insertComment(
  db: DbOrTx,
  values: {
    candidateId: number;
    revisionId: number | null;
    line: number | null;
    authorId: number;
    body: string;
  },
): Promise<CommentRow> {
  const [row] = await db.insert(comments).values(values).returning();
  return row!;
}
