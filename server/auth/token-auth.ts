import { and, eq, isNull } from 'drizzle-orm';
import type { Db } from '../db/client.ts';
import { apiTokens } from '../db/schema/api-tokens.ts';
import { users } from '../db/schema/users.ts';
import { hashSecret, looksLikeApiToken } from './api-token-secret.ts';
import type { CurrentUser } from './current-user.ts';

/**
 * How stale a token's `last_used_at` may get before a request writes it again: to the minute is
 * what the token list shows, and a write on every request cost about half of the token check
 * (benchmarks/README.md, service).
 */
export const LAST_USED_RESOLUTION_MS = 60_000;

/** The owner of a live (not revoked) API token, or null. Records when the token was last used. */
export async function userForApiToken(db: Db, token: string): Promise<CurrentUser | null> {
  if (!looksLikeApiToken(token)) return null;
  const [row] = await db
    .select({
      tokenId: apiTokens.id,
      lastUsedAt: apiTokens.lastUsedAt,
      id: users.id,
      login: users.login,
      isAdmin: users.isAdmin,
    })
    .from(apiTokens)
    .innerJoin(users, eq(users.id, apiTokens.userId))
    .where(and(eq(apiTokens.tokenHash, hashSecret(token)), isNull(apiTokens.revokedAt)))
    .limit(1);
  if (!row) return null;
  const now = new Date();
  if (!row.lastUsedAt || now.getTime() - row.lastUsedAt.getTime() >= LAST_USED_RESOLUTION_MS) {
    await db.update(apiTokens).set({ lastUsedAt: now }).where(eq(apiTokens.id, row.tokenId));
  }
  return { id: row.id, login: row.login, isAdmin: row.isAdmin, via: 'token' };
}
