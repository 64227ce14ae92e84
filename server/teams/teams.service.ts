import type { PaginationQuery } from '@shared/api/pagination.ts';
import type { CreateTeam, TeamDetail, TeamPage, TeamSummary } from '@shared/api/teams.ts';
import type { CurrentUser } from '@server/auth/current-user.ts';
import { recordAudit } from '@server/audit/audit.ts';
import type { Db } from '@server/db/client.ts';
import { AppError } from '@server/http/errors.ts';
import { insertMembership } from '@server/members/members.repo.ts';
import { mayCreateTeam, requireTeamRoleOrAdmin } from './teams.policy.ts';
import {
  findTeam,
  findUserByLogin,
  insertTeam,
  listTeamsFor,
  teamCounts,
  type TeamWithRole,
} from './teams.repo.ts';
import { isUniqueViolation } from './unique-violation.ts';

function toSummary(row: TeamWithRole): TeamSummary {
  return {
    id: row.id,
    slug: row.slug,
    name: row.name,
    myRole: row.myRole,
    createdAt: row.createdAt.toISOString(),
  };
}

/** The caller's teams by name; an admin sees every team. */
export async function listTeams(
  db: Db,
  user: CurrentUser,
  page: PaginationQuery,
): Promise<TeamPage> {
  const { rows, total } = await listTeamsFor(db, user.id, user.isAdmin, page);
  return { items: rows.map(toSummary), total, limit: page.limit, offset: page.offset };
}

/** A team with the caller's role and its counts: members and admins only. */
export async function getTeam(db: Db, user: CurrentUser, teamId: number): Promise<TeamDetail> {
  const myRole = await requireTeamRoleOrAdmin(db, user, teamId);
  const team = await findTeam(db, teamId);
  if (!team) throw new AppError('not-found', 'No such team.');
  return { ...toSummary({ ...team, myRole }), counts: await teamCounts(db, teamId) };
}

/**
 * Creates a team (admins). Its first maintainer is the person named, who must have signed in
 * before, or else the admin who creates it.
 */
export async function createTeam(
  db: Db,
  user: CurrentUser,
  input: CreateTeam,
): Promise<TeamDetail> {
  if (!mayCreateTeam(user)) throw new AppError('forbidden', 'Only an admin can create teams.');
  const maintainer = input.maintainerLogin
    ? await findUserByLogin(db, input.maintainerLogin)
    : { id: user.id, login: user.login };
  if (!maintainer) {
    throw new AppError('validation-failed', 'The request is not valid.', [
      {
        path: 'maintainerLogin',
        message: `nobody with the login ${input.maintainerLogin} has signed in yet`,
      },
    ]);
  }
  try {
    const team = await db.transaction(async (tx) => {
      const row = await insertTeam(tx, { slug: input.slug, name: input.name });
      await insertMembership(tx, { teamId: row.id, userId: maintainer.id, role: 'maintainer' });
      await recordAudit(tx, {
        actorId: user.id,
        teamId: row.id,
        action: 'team.created',
        entity: 'team',
        entityId: row.id,
        details: { name: row.name, slug: row.slug, maintainer: maintainer.login },
      });
      await recordAudit(tx, {
        actorId: user.id,
        teamId: row.id,
        action: 'member.added',
        entity: 'member',
        entityId: maintainer.id,
        details: { login: maintainer.login, role: 'maintainer' },
      });
      return row;
    });
    return getTeam(db, user, team.id);
  } catch (err) {
    if (isUniqueViolation(err, 'teams_slug_key')) {
      throw new AppError('conflict', `A team with the slug ${input.slug} exists already.`);
    }
    throw err;
  }
}
