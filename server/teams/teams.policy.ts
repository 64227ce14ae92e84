import type { TeamRole } from '@shared/roles.ts';
import type { CurrentUser } from '@server/auth/current-user.ts';
import type { Db } from '@server/db/client.ts';
import { AppError } from '@server/http/errors.ts';
import { requireTeamRole, teamRoleOf } from './team-access.ts';
import { findTeam } from './teams.repo.ts';

/** Only instance admins create teams. */
export function mayCreateTeam(user: CurrentUser): boolean {
  return user.isAdmin;
}

/**
 * For what an admin may do in any team (see the team and manage its members): an admin passes
 * for every team that exists, with their own role there or null; anyone else needs one of the
 * `allowed` roles (403 otherwise) and is refused with 404 outside the team.
 */
export async function requireTeamRoleOrAdmin(
  db: Db,
  user: CurrentUser,
  teamId: number,
  allowed?: readonly TeamRole[],
): Promise<TeamRole | null> {
  if (!user.isAdmin) return requireTeamRole(db, user, teamId, allowed);
  if (!(await findTeam(db, teamId))) throw new AppError('not-found', 'No such team.');
  return teamRoleOf(db, teamId, user.id);
}
