import { and, eq } from 'drizzle-orm';
import type { TeamRole } from '@shared/roles.ts';
import type { CurrentUser } from '../auth/current-user.ts';
import type { Db } from '../db/client.ts';
import { memberships } from '../db/schema/memberships.ts';
import { AppError } from '../http/errors.ts';

/** The person's role in a team, or null when they are not a member. */
export async function teamRoleOf(db: Db, teamId: number, userId: number): Promise<TeamRole | null> {
  const [row] = await db
    .select({ role: memberships.role })
    .from(memberships)
    .where(and(eq(memberships.teamId, teamId), eq(memberships.userId, userId)))
    .limit(1);
  return row?.role ?? null;
}

/**
 * The caller's role in a team. People outside a team see nothing of it, so a non-member gets
 * the same 404 as a team that does not exist (no probing by id). With `allowed`, a member
 * whose role is not listed gets 403.
 */
export async function requireTeamRole(
  db: Db,
  user: CurrentUser,
  teamId: number,
  allowed?: readonly TeamRole[],
  what = 'team',
): Promise<TeamRole> {
  const role = await teamRoleOf(db, teamId, user.id);
  if (!role) throw new AppError('not-found', `No such ${what}.`);
  if (allowed && !allowed.includes(role)) {
    throw new AppError(
      'forbidden',
      `This needs the ${allowed.join(' or ')} role in the team; you are ${role}.`,
    );
  }
  return role;
}
