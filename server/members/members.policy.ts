import type { TeamRole } from '@shared/roles.ts';
import type { CurrentUser } from '@server/auth/current-user.ts';
import type { Db } from '@server/db/client.ts';
import { requireTeamRoleOrAdmin } from '@server/teams/teams.policy.ts';

/** Maintainers manage a team's members (and its invitations); so may an instance admin. */
export const memberManagers: readonly TeamRole[] = ['maintainer'];

/** Every member may see who else is in the team; so may an admin. */
export function requireMemberReader(db: Db, user: CurrentUser, teamId: number) {
  return requireTeamRoleOrAdmin(db, user, teamId);
}

/** A maintainer of the team, or an admin: 403 for other members, 404 outside the team. */
export function requireMemberManager(db: Db, user: CurrentUser, teamId: number) {
  return requireTeamRoleOrAdmin(db, user, teamId, memberManagers);
}
