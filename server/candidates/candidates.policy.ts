import type { TeamRole } from '@shared/roles.ts';
import type { CandidateState } from '@shared/states.ts';
import type { CurrentUser } from '@server/auth/current-user.ts';
import { AppError } from '@server/http/errors.ts';

/*
 * Who may do what with candidates, revisions and comments. Reading, submitting a candidate and
 * commenting need any role in the routine's team (candidate-access.ts turns everyone else away
 * with 404): reviewers and maintainers write kernels too, and the rule that matters, that nobody
 * reviews their own candidate, is enforced on the verdict (reviews.policy.ts). Reviewers ask in
 * comments and authors answer, so every member may comment.
 */

/** Only the candidate's author adds revisions; the source is theirs. */
export function mayRevise(user: CurrentUser, candidate: { authorId: number }): boolean {
  return candidate.authorId === user.id;
}

/** The author withdraws their own candidate; a maintainer may withdraw any. */
export function mayWithdraw(
  user: CurrentUser,
  role: TeamRole,
  candidate: { authorId: number },
): boolean {
  return candidate.authorId === user.id || role === 'maintainer';
}

/** States from which a new revision puts the candidate on trial again. */
export const revisableStates: readonly CandidateState[] = [
  'drafting',
  'returned',
  'trial-failed',
  'in-review',
  'cleared',
];

export function requireRevise(user: CurrentUser, candidate: { authorId: number }): void {
  if (!mayRevise(user, candidate)) {
    throw new AppError('forbidden', "Only the candidate's author can add a revision.");
  }
}

export function requireWithdraw(
  user: CurrentUser,
  role: TeamRole,
  candidate: { authorId: number },
): void {
  if (!mayWithdraw(user, role, candidate)) {
    throw new AppError(
      'forbidden',
      "Only the candidate's author or a maintainer can withdraw a candidate.",
    );
  }
}
