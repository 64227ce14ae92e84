import { index, integer, pgEnum, pgTable, text, timestamp } from 'drizzle-orm/pg-core';
import { reviewVerdicts } from '@shared/states.ts';
import { candidates } from './candidates.ts';
import { revisions } from './revisions.ts';
import { users } from './users.ts';

export const reviewVerdictEnum = pgEnum('review_verdict', reviewVerdicts);

/** A reviewer's verdict on one revision: sign off, or send back with a reason. */
export const reviews = pgTable(
  'reviews',
  {
    id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
    candidateId: integer('candidate_id')
      .notNull()
      .references(() => candidates.id, { onDelete: 'cascade' }),
    revisionId: integer('revision_id')
      .notNull()
      .references(() => revisions.id, { onDelete: 'cascade' }),
    reviewerId: integer('reviewer_id')
      .notNull()
      .references(() => users.id),
    verdict: reviewVerdictEnum('verdict').notNull(),
    body: text('body').notNull().default(''),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('reviews_candidate_idx').on(t.candidateId, t.revisionId)],
);
