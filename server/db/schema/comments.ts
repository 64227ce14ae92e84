import { index, integer, pgTable, text, timestamp } from 'drizzle-orm/pg-core';
import { candidates } from './candidates.ts';
import { revisions } from './revisions.ts';
import { users } from './users.ts';

/** A comment on a candidate, optionally on one line of one revision. */
export const comments = pgTable(
  'comments',
  {
    id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
    candidateId: integer('candidate_id')
      .notNull()
      .references(() => candidates.id, { onDelete: 'cascade' }),
    revisionId: integer('revision_id').references(() => revisions.id, { onDelete: 'cascade' }),
    line: integer('line'),
    authorId: integer('author_id')
      .notNull()
      .references(() => users.id),
    body: text('body').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('comments_candidate_idx').on(t.candidateId, t.createdAt)],
);
