import { integer, jsonb, pgTable, text, timestamp, uniqueIndex } from 'drizzle-orm/pg-core';
import type { KernelDiagnostic } from '@shared/contracts/kernel-diagnostic.ts';
import { candidates } from './candidates.ts';
import { users } from './users.ts';

/** One immutable version of a candidate's source. */
export const revisions = pgTable(
  'revisions',
  {
    id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
    candidateId: integer('candidate_id')
      .notNull()
      .references(() => candidates.id, { onDelete: 'cascade' }),
    number: integer('number').notNull(),
    source: text('source').notNull(),
    /** SHA-256 of the source, hex. */
    sourceHash: text('source_hash').notNull(),
    diagnostics: jsonb('diagnostics').$type<KernelDiagnostic[]>().notNull(),
    /**
     * The checker that produced `diagnostics`, such as `TypeScript 5.9.3`; null for revisions
     * stored before the check was recorded. A trial skips its own check only for a revision
     * that passed with the checker it would use itself.
     */
    checkedWith: text('checked_with'),
    createdBy: integer('created_by')
      .notNull()
      .references(() => users.id),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex('revisions_candidate_number_key').on(t.candidateId, t.number)],
);
