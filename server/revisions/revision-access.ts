import type { CurrentUser } from '@server/auth/current-user.ts';
import type { Db } from '@server/db/client.ts';
import { AppError } from '@server/http/errors.ts';
import { candidateAccess, type CandidateAccess } from '@server/candidates/candidate-access.ts';
import { findRevision, type RevisionWithCreator } from './revisions.repo.ts';

/** The revision, its candidate and routine, and the caller's role; 404 for outsiders. */
export async function revisionAccess(
  db: Db,
  user: CurrentUser,
  revisionId: number,
): Promise<CandidateAccess & RevisionWithCreator> {
  const found = await findRevision(db, revisionId);
  if (!found) throw new AppError('not-found', 'No such revision.');
  const access = await candidateAccess(db, user, found.revision.candidateId, 'revision');
  return { ...access, ...found };
}
