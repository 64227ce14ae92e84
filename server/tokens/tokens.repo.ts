import { and, count, desc, eq, isNull } from 'drizzle-orm';
import type { Db } from '@server/db/client.ts';
import { apiTokens } from '@server/db/schema/api-tokens.ts';

export type ApiTokenRow = typeof apiTokens.$inferSelect;

export async function insertToken(
  db: Db,
  values: { userId: number; name: string; tokenHash: string; prefix: string },
): Promise<ApiTokenRow> {
  const [row] = await db.insert(apiTokens).values(values).returning();
  return row!;
}

export async function findToken(db: Db, id: number): Promise<ApiTokenRow | null> {
  const [row] = await db.select().from(apiTokens).where(eq(apiTokens.id, id)).limit(1);
  return row ?? null;
}

/** A page of one person's tokens, newest first, and how many they have in all. */
export async function listTokensOf(
  db: Db,
  userId: number,
  page: { limit: number; offset: number },
): Promise<{ rows: ApiTokenRow[]; total: number }> {
  const [rows, [totals]] = await Promise.all([
    db
      .select()
      .from(apiTokens)
      .where(eq(apiTokens.userId, userId))
      .orderBy(desc(apiTokens.createdAt), desc(apiTokens.id))
      .limit(page.limit)
      .offset(page.offset),
    db.select({ total: count() }).from(apiTokens).where(eq(apiTokens.userId, userId)),
  ]);
  return { rows, total: totals?.total ?? 0 };
}

/** Marks a live token revoked; a token revoked before keeps its first revocation time. */
export async function revokeTokenRow(db: Db, id: number): Promise<ApiTokenRow | null> {
  const [row] = await db
    .update(apiTokens)
    .set({ revokedAt: new Date() })
    .where(and(eq(apiTokens.id, id), isNull(apiTokens.revokedAt)))
    .returning();
  return row ?? (await findToken(db, id));
}
