import type { Member, MemberPage, UpdateMember } from '@shared/api/members.ts';
import type { PaginationQuery } from '@shared/api/pagination.ts';
import type { CurrentUser } from '@server/auth/current-user.ts';
import { recordAudit } from '@server/audit/audit.ts';
import type { Db } from '@server/db/client.ts';
import { AppError } from '@server/http/errors.ts';
import type { DbOrTx } from '@server/mail/outbox.repo.ts';
import { lockTeam } from '@server/teams/teams.repo.ts';
import { requireMemberManager, requireMemberReader } from './members.policy.ts';
import {
  countMaintainers,
  deleteMembership,
  findMember,
  listMembers as listMemberRows,
  setMemberRole,
  type MemberRow,
} from './members.repo.ts';

export function toMember(row: MemberRow): Member {
  return { ...row, joinedAt: row.joinedAt.toISOString() };
}

export async function listMembers(
  db: Db,
  user: CurrentUser,
  teamId: number,
  page: PaginationQuery,
): Promise<MemberPage> {
  await requireMemberReader(db, user, teamId);
  const { rows, total } = await listMemberRows(db, teamId, page);
  return { items: rows.map(toMember), total, limit: page.limit, offset: page.offset };
}

/**
 * Locks the team and finds the member; a change that would leave the team without a
 * maintainer is refused. Locking the team row makes concurrent changes wait for each other, so
 * two maintainers stepping down at once cannot both succeed.
 */
async function lockedMember(tx: DbOrTx, teamId: number, userId: number): Promise<MemberRow> {
  await lockTeam(tx, teamId);
  const member = await findMember(tx, teamId, userId);
  if (!member) throw new AppError('not-found', 'No such member of this team.');
  return member;
}

async function keepOneMaintainer(tx: DbOrTx, teamId: number, member: MemberRow, what: string) {
  if (member.role === 'maintainer' && (await countMaintainers(tx, teamId)) <= 1) {
    throw new AppError(
      'conflict',
      `${member.login} is the team's only maintainer; make someone else maintainer before you ${what}.`,
    );
  }
}

export async function changeMemberRole(
  db: Db,
  user: CurrentUser,
  teamId: number,
  userId: number,
  input: UpdateMember,
): Promise<Member> {
  await requireMemberManager(db, user, teamId);
  return db.transaction(async (tx) => {
    const member = await lockedMember(tx, teamId, userId);
    if (member.role === input.role) return toMember(member);
    if (input.role !== 'maintainer') await keepOneMaintainer(tx, teamId, member, 'change the role');
    await setMemberRole(tx, teamId, userId, input.role);
    await recordAudit(tx, {
      actorId: user.id,
      teamId,
      action: 'member.role-changed',
      entity: 'member',
      entityId: userId,
      details: { login: member.login, from: member.role, to: input.role },
    });
    return toMember({ ...member, role: input.role });
  });
}

export async function removeMember(
  db: Db,
  user: CurrentUser,
  teamId: number,
  userId: number,
): Promise<void> {
  await requireMemberManager(db, user, teamId);
  await db.transaction(async (tx) => {
    const member = await lockedMember(tx, teamId, userId);
    await keepOneMaintainer(tx, teamId, member, 'remove them');
    await deleteMembership(tx, teamId, userId);
    await recordAudit(tx, {
      actorId: user.id,
      teamId,
      action: 'member.removed',
      entity: 'member',
      entityId: userId,
      details: { login: member.login, role: member.role },
    });
  });
}
