import { asc, eq } from 'drizzle-orm';
import type { Db } from '@server/db/client.ts';
import { memberships } from '@server/db/schema/memberships.ts';
import { teams } from '@server/db/schema/teams.ts';
import { users } from '@server/db/schema/users.ts';

export async function findProfile(db: Db, userId: number) {
  const [row] = await db
    .select({
      id: users.id,
      login: users.login,
      name: users.displayName,
      email: users.email,
      isAdmin: users.isAdmin,
    })
    .from(users)
    .where(eq(users.id, userId))
    .limit(1);
  return row ?? null;
}

export function listTeamsOf(db: Db, userId: number) {
  return db
    .select({ id: teams.id, slug: teams.slug, name: teams.name, role: memberships.role })
    .from(memberships)
    .innerJoin(teams, eq(teams.id, memberships.teamId))
    .where(eq(memberships.userId, userId))
    .orderBy(asc(teams.name), asc(teams.id));
}
