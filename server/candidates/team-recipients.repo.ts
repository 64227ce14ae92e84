import { and, eq, inArray, isNotNull } from 'drizzle-orm';
import type { TeamRole } from '@shared/roles.ts';
import { memberships } from '@server/db/schema/memberships.ts';
import { teams } from '@server/db/schema/teams.ts';
import { users } from '@server/db/schema/users.ts';
import type { DbOrTx } from '@server/mail/outbox.repo.ts';

/** E-mail addresses of a team's members, optionally only those with one of `roles`. */
export async function teamAddresses(
  db: DbOrTx,
  teamId: number,
  roles?: readonly TeamRole[],
  exceptUserId?: number,
): Promise<string[]> {
  const rows = await db
    .select({ id: users.id, email: users.email })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(
      and(
        eq(memberships.teamId, teamId),
        isNotNull(users.email),
        roles ? inArray(memberships.role, [...roles]) : undefined,
      ),
    );
  return rows.filter((r) => r.id !== exceptUserId).map((r) => r.email!);
}

export interface Contact {
  /** The display name, or the login when there is none. */
  name: string;
  email: string | null;
}

export async function contactOf(db: DbOrTx, userId: number): Promise<Contact> {
  const [row] = await db
    .select({ login: users.login, name: users.displayName, email: users.email })
    .from(users)
    .where(eq(users.id, userId))
    .limit(1);
  return { name: row?.name ?? row?.login ?? 'someone', email: row?.email ?? null };
}

export async function teamNames(
  db: DbOrTx,
  teamId: number,
): Promise<{ name: string; slug: string }> {
  const [row] = await db
    .select({ name: teams.name, slug: teams.slug })
    .from(teams)
    .where(eq(teams.id, teamId))
    .limit(1);
  return row ?? { name: 'your team', slug: '' };
}
