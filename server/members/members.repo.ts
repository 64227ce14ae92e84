import { and, asc, count, eq } from 'drizzle-orm';
import type { TeamRole } from '@shared/roles.ts';
import type { Db } from '@server/db/client.ts';
import { memberships } from '@server/db/schema/memberships.ts';
import { users } from '@server/db/schema/users.ts';
import type { DbOrTx } from '@server/mail/outbox.repo.ts';

export interface MemberRow {
  userId: number;
  login: string;
  name: string | null;
  role: TeamRole;
  joinedAt: Date;
}

const memberColumns = {
  userId: memberships.userId,
  login: users.login,
  name: users.displayName,
  role: memberships.role,
  joinedAt: memberships.createdAt,
};

export async function insertMembership(
  tx: DbOrTx,
  values: { teamId: number; userId: number; role: TeamRole },
): Promise<void> {
  await tx.insert(memberships).values(values);
}

export async function findMember(
  db: DbOrTx,
  teamId: number,
  userId: number,
): Promise<MemberRow | null> {
  const [row] = await db
    .select(memberColumns)
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.teamId, teamId), eq(memberships.userId, userId)))
    .limit(1);
  return row ?? null;
}

/** A page of a team's members by login, and how many it has. */
export async function listMembers(
  db: Db,
  teamId: number,
  page: { limit: number; offset: number },
): Promise<{ rows: MemberRow[]; total: number }> {
  const [rows, [totals]] = await Promise.all([
    db
      .select(memberColumns)
      .from(memberships)
      .innerJoin(users, eq(users.id, memberships.userId))
      .where(eq(memberships.teamId, teamId))
      .orderBy(asc(users.login))
      .limit(page.limit)
      .offset(page.offset),
    db.select({ total: count() }).from(memberships).where(eq(memberships.teamId, teamId)),
  ]);
  return { rows, total: totals?.total ?? 0 };
}

export async function countMaintainers(tx: DbOrTx, teamId: number): Promise<number> {
  const [row] = await tx
    .select({ n: count() })
    .from(memberships)
    .where(and(eq(memberships.teamId, teamId), eq(memberships.role, 'maintainer')));
  return row?.n ?? 0;
}

export async function setMemberRole(
  tx: DbOrTx,
  teamId: number,
  userId: number,
  role: TeamRole,
): Promise<void> {
  await tx
    .update(memberships)
    .set({ role })
    .where(and(eq(memberships.teamId, teamId), eq(memberships.userId, userId)));
}

export async function deleteMembership(tx: DbOrTx, teamId: number, userId: number) {
  await tx
    .delete(memberships)
    .where(and(eq(memberships.teamId, teamId), eq(memberships.userId, userId)));
}
