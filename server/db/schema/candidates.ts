import { index, integer, pgEnum, pgTable, text, timestamp } from 'drizzle-orm/pg-core';
import { candidateStates } from '@shared/states.ts';
import { routines } from './routines.ts';
import { users } from './users.ts';

export const candidateStateEnum = pgEnum('candidate_state', candidateStates);

export const candidates = pgTable(
  'candidates',
  {
    id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
    routineId: integer('routine_id')
      .notNull()
      .references(() => routines.id, { onDelete: 'cascade' }),
    authorId: integer('author_id')
      .notNull()
      .references(() => users.id),
    title: text('title').notNull(),
    description: text('description').notNull().default(''),
    state: candidateStateEnum('state').notNull().default('drafting'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index('candidates_routine_state_idx').on(t.routineId, t.state),
    index('candidates_author_idx').on(t.authorId),
  ],
);
