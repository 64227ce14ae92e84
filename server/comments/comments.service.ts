import type { Comment, CommentPage, CreateComment } from '@shared/api/comments.ts';
import type { PaginationQuery } from '@shared/api/pagination.ts';
import type { CurrentUser } from '@server/auth/current-user.ts';
import type { Db } from '@server/db/client.ts';
import { AppError } from '@server/http/errors.ts';
import { candidateAccess } from '@server/candidates/candidate-access.ts';
import { findRevision } from '@server/revisions/revisions.repo.ts';
import {
  findComment,
  insertComment,
  listCommentRows,
  type CommentListRow,
} from './comments.repo.ts';

function toComment({ comment, revisionNumber, author }: CommentListRow): Comment {
  return {
    id: comment.id,
    candidateId: comment.candidateId,
    revisionId: comment.revisionId,
    revisionNumber,
    line: comment.line,
    author,
    body: comment.body,
    createdAt: comment.createdAt.toISOString(),
  };
}

/** Lines of a source as an editor numbers them; a final line break does not open a new line. */
export function lineCount(source: string): number {
  const lines = source.split(/\r\n|\r|\n/);
  return lines.length > 1 && lines.at(-1) === '' ? lines.length - 1 : lines.length;
}

export async function listComments(
  db: Db,
  user: CurrentUser,
  candidateId: number,
  page: PaginationQuery,
): Promise<CommentPage> {
  await candidateAccess(db, user, candidateId);
  const { rows, total } = await listCommentRows(db, candidateId, page);
  return { items: rows.map(toComment), total, limit: page.limit, offset: page.offset };
}

function invalid(path: string, message: string): AppError {
  return new AppError('validation-failed', 'The request is not valid.', [{ path, message }]);
}

/**
 * A comment by any member of the team: general, on a revision of this candidate, or on one
 * line that exists in that revision's source.
 */
export async function addComment(
  db: Db,
  user: CurrentUser,
  candidateId: number,
  input: CreateComment,
): Promise<Comment> {
  await candidateAccess(db, user, candidateId);
  if (input.revisionId !== undefined) {
    const found = await findRevision(db, input.revisionId);
    if (!found || found.revision.candidateId !== candidateId) {
      throw invalid('revisionId', 'not a revision of this candidate');
    }
    const lines = lineCount(found.revision.source);
    if (input.line !== undefined && input.line > lines) {
      throw invalid('line', `revision ${found.revision.number} has ${lines} lines`);
    }
  }
  const row = await insertComment(db, {
    candidateId,
    revisionId: input.revisionId ?? null,
    line: input.line ?? null,
    authorId: user.id,
    body: input.body,
  });
  return toComment((await findComment(db, row.id))!);
}
