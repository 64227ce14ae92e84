import type { Db } from '@server/db/client.ts';
import type { CurrentUser } from './current-user.ts';
import {
  anyUserExists,
  findUserByGithubId,
  findUserById,
  insertUser,
  lockUsersForSignIn,
  loginHeldByOther,
  updateUserFromGithub,
  type GithubPerson,
} from './sign-in.repo.ts';

/**
 * Records a person who signed in with the provider: a known GitHub id gets its login, name and
 * e-mail refreshed; a new one becomes a user, and the first user of a fresh instance becomes its
 * admin. Returns null when the login is held by a different account (the provider's logins are
 * unique, so ours must be too; an admin has to sort that out).
 */
export async function signInWithGithub(db: Db, person: GithubPerson): Promise<CurrentUser | null> {
  const row = await db.transaction(async (tx) => {
    await lockUsersForSignIn(tx);
    if (await loginHeldByOther(tx, person.login, person.githubId)) return null;
    const known = await findUserByGithubId(tx, person.githubId);
    if (known) return updateUserFromGithub(tx, known.id, person);
    return insertUser(tx, person, !(await anyUserExists(tx)));
  });
  return row && { id: row.id, login: row.login, isAdmin: row.isAdmin, via: 'session' };
}

/** The user a session points at, or null when that user no longer exists. */
export async function sessionUser(db: Db, id: number): Promise<CurrentUser | null> {
  const row = await findUserById(db, id);
  return row && { id: row.id, login: row.login, isAdmin: row.isAdmin, via: 'session' };
}
