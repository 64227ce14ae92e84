import { and, asc, count, eq, gt, isNull } from 'drizzle-orm';
import type { TeamRole } from '@shared/roles.ts';
import type { Db } from '@server/db/client.ts';
import { invitations } from '@server/db/schema/invitations.ts';
import { matrixSets } from '@server/db/schema/matrix-sets.ts';
import { memberships } from '@server/db/schema/memberships.ts';
import { routines } from '@server/db/schema/routines.ts';
import { teams } from '@server/db/schema/teams.ts';
import { uploads } from '@server/db/schema/uploads.ts';
import { users } from '@server/db/schema/users.ts';
import type { DbOrTx } from '@server/mail/outbox.repo.ts';

export type TeamRow = typeof teams.$inferSelect;
export interface TeamWithRole extends TeamRow {
  myRole: TeamRole | null;
}

export async function findTeam(db: DbOrTx, id: number): Promise<TeamRow | null> {
  const [row] = await db.select().from(teams).where(eq(teams.id, id)).limit(1);
  return row ?? null;
}

/** The team row, locked until the transaction ends: membership changes happen one at a time. */
export async function lockTeam(tx: DbOrTx, id: number): Promise<TeamRow | null> {
  const [row] = await tx.select().from(teams).where(eq(teams.id, id)).for('update');
  return row ?? null;
}

export async function insertTeam(tx: DbOrTx, values: { slug: string; name: string }) {
  const [row] = await tx.insert(teams).values(values).returning();
  return row!;
}

export async function findUserByLogin(db: DbOrTx, login: string) {
  const [row] = await db
    .select({ id: users.id, login: users.login })
    .from(users)
    .where(eq(users.login, login))
    .limit(1);
  return row ?? null;
}

/**
 * A page of teams by name with the caller's role in each: the caller's own teams, or with
 * `all` every team (for an admin, whose role is null where they are not a member).
 */
export async function listTeamsFor(
  db: Db,
  userId: number,
  all: boolean,
  page: { limit: number; offset: number },
): Promise<{ rows: TeamWithRole[]; total: number }> {
  const mine = and(eq(memberships.teamId, teams.id), eq(memberships.userId, userId));
  const columns = {
    id: teams.id,
    slug: teams.slug,
    name: teams.name,
    createdAt: teams.createdAt,
    myRole: memberships.role,
  };
  const order = [asc(teams.name), asc(teams.id)] as const;
  const [rows, [totals]] = await Promise.all([
    all
      ? db
          .select(columns)
          .from(teams)
          .leftJoin(memberships, mine)
          .orderBy(...order)
          .limit(page.limit)
          .offset(page.offset)
      : db
          .select(columns)
          .from(teams)
          .innerJoin(memberships, mine)
          .orderBy(...order)
          .limit(page.limit)
          .offset(page.offset),
    all
      ? db.select({ total: count() }).from(teams)
      : db.select({ total: count() }).from(teams).innerJoin(memberships, mine),
  ]);
  return { rows, total: totals?.total ?? 0 };
}

/** How many members, maintainers, routines, matrix sets, uploads and live invitations a team has. */
export async function teamCounts(db: Db, teamId: number) {
  const countOf = async (query: Promise<{ n: number }[]>) => (await query)[0]?.n ?? 0;
  // In turn, not at once: the demo loader calls createTeam with its transaction as `db`, and
  // a transaction's one connection takes one query at a time.
  const members = await countOf(
    db.select({ n: count() }).from(memberships).where(eq(memberships.teamId, teamId)),
  );
  const maintainers = await countOf(
    db
      .select({ n: count() })
      .from(memberships)
      .where(and(eq(memberships.teamId, teamId), eq(memberships.role, 'maintainer'))),
  );
  const routineCount = await countOf(
    db.select({ n: count() }).from(routines).where(eq(routines.teamId, teamId)),
  );
  const sets = await countOf(
    db.select({ n: count() }).from(matrixSets).where(eq(matrixSets.teamId, teamId)),
  );
  const files = await countOf(
    db.select({ n: count() }).from(uploads).where(eq(uploads.teamId, teamId)),
  );
  const pending = await countOf(
    db
      .select({ n: count() })
      .from(invitations)
      .where(
        and(
          eq(invitations.teamId, teamId),
          isNull(invitations.acceptedAt),
          isNull(invitations.revokedAt),
          gt(invitations.expiresAt, new Date()),
        ),
      ),
  );
  return {
    members,
    maintainers,
    routines: routineCount,
    matrixSets: sets,
    uploads: files,
    pendingInvitations: pending,
  };
}
