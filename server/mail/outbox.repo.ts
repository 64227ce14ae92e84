import { and, asc, eq, isNull, lte, sql } from 'drizzle-orm';
import type { NodePgQueryResultHKT } from 'drizzle-orm/node-postgres';
import type { PgDatabase } from 'drizzle-orm/pg-core';
import type { Db, schema } from '@server/db/client.ts';
import { emailOutbox } from '@server/db/schema/email-outbox.ts';

/** The database or a transaction opened on it: both can enqueue. */
export type DbOrTx = PgDatabase<NodePgQueryResultHKT, typeof schema>;

export interface NewOutboxRow {
  kind: string;
  toAddress: string;
  subject: string;
  textBody: string;
  htmlBody: string;
}

export async function insertOutboxRows(db: DbOrTx, rows: NewOutboxRow[]): Promise<number[]> {
  if (rows.length === 0) return [];
  const inserted = await db.insert(emailOutbox).values(rows).returning({ id: emailOutbox.id });
  return inserted.map((r) => r.id);
}

export interface ClaimedEmail {
  id: number;
  toAddress: string;
  subject: string;
  textBody: string;
  htmlBody: string;
  attempts: number;
}

/**
 * Claims up to `limit` unsent rows that are due, oldest first, by moving their `next_attempt_at`
 * `leaseMs` ahead in the same statement. `FOR UPDATE SKIP LOCKED` lets concurrent senders claim
 * disjoint rows without waiting; the lease hides claimed rows from them after commit, and hands
 * the rows back if this sender dies before it records the outcome.
 */
export async function claimDueEmail(
  db: Db,
  limit: number,
  leaseMs: number,
): Promise<ClaimedEmail[]> {
  const due = db.$with('due').as(
    db
      .select({ id: emailOutbox.id })
      .from(emailOutbox)
      .where(and(isNull(emailOutbox.sentAt), lte(emailOutbox.nextAttemptAt, sql`now()`)))
      .orderBy(asc(emailOutbox.nextAttemptAt), asc(emailOutbox.id))
      .limit(limit)
      .for('update', { skipLocked: true }),
  );
  return db
    .with(due)
    .update(emailOutbox)
    .set({ nextAttemptAt: sql`now() + ${leaseMs}::integer * interval '1 millisecond'` })
    .from(due)
    .where(eq(emailOutbox.id, due.id))
    .returning({
      id: emailOutbox.id,
      toAddress: emailOutbox.toAddress,
      subject: emailOutbox.subject,
      textBody: emailOutbox.textBody,
      htmlBody: emailOutbox.htmlBody,
      attempts: emailOutbox.attempts,
    });
}

export async function markEmailSent(db: Db, id: number): Promise<void> {
  await db
    .update(emailOutbox)
    .set({ sentAt: sql`now()`, lastError: null })
    .where(and(eq(emailOutbox.id, id), isNull(emailOutbox.sentAt)));
}

/** Records a failed attempt and when to try again; the row stays for the next try. */
export async function markEmailFailed(
  db: Db,
  id: number,
  attempts: number,
  error: string,
  retryInMs: number,
): Promise<void> {
  await db
    .update(emailOutbox)
    .set({
      attempts,
      lastError: error,
      nextAttemptAt: sql`now() + ${retryInMs}::integer * interval '1 millisecond'`,
    })
    .where(and(eq(emailOutbox.id, id), isNull(emailOutbox.sentAt)));
}
