import { index, integer, pgTable, text, timestamp } from 'drizzle-orm/pg-core';

/** E-mail waiting to be sent; a sender drains it with retry so an unreachable server loses nothing. */
export const emailOutbox = pgTable(
  'email_outbox',
  {
    id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
    kind: text('kind').notNull(),
    toAddress: text('to_address').notNull(),
    subject: text('subject').notNull(),
    textBody: text('text_body').notNull(),
    htmlBody: text('html_body').notNull(),
    attempts: integer('attempts').notNull().default(0),
    nextAttemptAt: timestamp('next_attempt_at', { withTimezone: true }).notNull().defaultNow(),
    lastError: text('last_error'),
    sentAt: timestamp('sent_at', { withTimezone: true }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('email_outbox_pending_idx').on(t.sentAt, t.nextAttemptAt)],
);
