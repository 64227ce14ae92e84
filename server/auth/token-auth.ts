import { and, eq, isNull } from 'drizzle-orm';
import type { Db } from '../db/client.ts';
import { apiTokens } from '../db/schema/api-tokens.ts';
import { users } from '../db/schema/users.ts';
import { hashSecret, looksLikeApiToken } from './api-token-secret.ts';
import type { CurrentUser } from './current-user.ts';

/** The owner of a live (not revoked) API token, or null. Records when the token was last used. */
export async function userForApiToken(db: Db, token: string): Promise<CurrentUser | null> {
  if (!looksLikeApiToken(token)) return null;
  const [row] = await db
    .select({ tokenId: apiTokens.id, id: users.id, login: users.login, isAdmin: users.isAdmin })
    .from(apiTokens)
    .innerJoin(users, eq(users.id, apiTokens.userId))
    .where(and(eq(apiTokens.tokenHash, hashSecret(token)), isNull(apiTokens.revokedAt)))
    .limit(1);
  if (!row) return null;
  await db.update(apiTokens).set({ lastUsedAt: new Date() }).where(eq(apiTokens.id, row.tokenId));
  return { id: row.id, login: row.login, isAdmin: row.isAdmin, via: 'token' };
}
