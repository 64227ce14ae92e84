import type { TeamRole } from '@shared/roles.ts';
import type { CurrentUser } from '@server/auth/current-user.ts';

/** Roles that give verdicts: reviewers, and maintainers, who may do what reviewers do. */
const reviewingRoles: readonly TeamRole[] = ['reviewer', 'maintainer'];

/**
 * Why the caller may not sign off or send back this candidate, or null when they may. An author
 * never reviews their own candidate, whatever their role.
 */
export function reviewRefusal(
  user: CurrentUser,
  role: TeamRole,
  candidate: { authorId: number },
): string | null {
  if (candidate.authorId === user.id) {
    return 'You cannot sign off or send back your own candidate; another reviewer must.';
  }
  if (!reviewingRoles.includes(role)) {
    return `Only reviewers and maintainers sign off or send back candidates; you are ${role}.`;
  }
  return null;
}
