import { randomUUID } from 'node:crypto';
import type { Db } from '@server/db/client.ts';
import { apiTokens } from '@server/db/schema/api-tokens.ts';
import { users } from '@server/db/schema/users.ts';
import { generateApiToken } from '@server/auth/api-token-secret.ts';

export interface TestUser {
  id: number;
  login: string;
  token: string;
  /** Headers that authenticate as this user (Bearer token). */
  headers: Record<string, string>;
}

/** Creates a user with a live API token, straight in the database. Logins are unique per call. */
export async function createTestUser(
  db: Db,
  options: { login?: string; isAdmin?: boolean } = {},
): Promise<TestUser> {
  const login = options.login ?? `user-${randomUUID().slice(0, 8)}`;
  const [user] = await db
    .insert(users)
    .values({
      githubId: `test-${randomUUID()}`,
      login,
      email: `${login}@example.test`,
      isAdmin: options.isAdmin ?? false,
    })
    .returning();
  const { token, hash, prefix } = generateApiToken();
  await db.insert(apiTokens).values({ userId: user!.id, name: 'test', tokenHash: hash, prefix });
  return {
    id: user!.id,
    login,
    token,
    headers: { authorization: `Bearer ${token}`, 'content-type': 'application/json' },
  };
}
