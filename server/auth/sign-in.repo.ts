import { and, eq, ne, sql } from 'drizzle-orm';
import type { Db } from '@server/db/client.ts';
import { users } from '@server/db/schema/users.ts';

type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];
export type UserRow = typeof users.$inferSelect;

/**
 * Takes a lock that conflicts with itself and with every insert into users, held until the
 * transaction ends, so "is anyone here yet?" and the insert that follows cannot interleave with
 * another sign-in.
 */
export async function lockUsersForSignIn(tx: Tx): Promise<void> {
  await tx.execute(sql`lock table ${users} in share row exclusive mode`);
}

export async function findUserByGithubId(tx: Tx, githubId: string): Promise<UserRow | null> {
  const [row] = await tx.select().from(users).where(eq(users.githubId, githubId)).limit(1);
  return row ?? null;
}

/** Whether a person other than `githubId` already holds this login. */
export async function loginHeldByOther(tx: Tx, login: string, githubId: string): Promise<boolean> {
  const [row] = await tx
    .select({ id: users.id })
    .from(users)
    .where(and(eq(users.login, login), ne(users.githubId, githubId)))
    .limit(1);
  return row !== undefined;
}

export async function anyUserExists(tx: Tx): Promise<boolean> {
  const [row] = await tx.select({ id: users.id }).from(users).limit(1);
  return row !== undefined;
}

export interface GithubPerson {
  githubId: string;
  login: string;
  name: string | null;
  email: string | null;
}

export async function insertUser(tx: Tx, person: GithubPerson, isAdmin: boolean): Promise<UserRow> {
  const [row] = await tx
    .insert(users)
    .values({
      githubId: person.githubId,
      login: person.login,
      displayName: person.name,
      email: person.email,
      isAdmin,
    })
    .returning();
  return row!;
}

/** Refreshes what the provider says about a known person; keeps a known e-mail if none is sent. */
export async function updateUserFromGithub(
  tx: Tx,
  id: number,
  person: GithubPerson,
): Promise<UserRow> {
  const [row] = await tx
    .update(users)
    .set({
      login: person.login,
      displayName: person.name,
      ...(person.email ? { email: person.email } : {}),
    })
    .where(eq(users.id, id))
    .returning();
  return row!;
}

export async function findUserById(db: Db, id: number): Promise<UserRow | null> {
  const [row] = await db.select().from(users).where(eq(users.id, id)).limit(1);
  return row ?? null;
}
