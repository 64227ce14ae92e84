import {
  type AnyPgColumn,
  integer,
  jsonb,
  pgEnum,
  pgTable,
  text,
  timestamp,
  uniqueIndex,
} from 'drizzle-orm/pg-core';
import type { AcceptancePolicy } from '@shared/acceptance-policy.ts';
import { routineSlugs } from '@shared/routines.ts';
import { matrixSets } from './matrix-sets.ts';
import { revisions } from './revisions.ts';
import { teams } from './teams.ts';

export const contractEnum = pgEnum('contract', routineSlugs);

/** A team's routine: a contract, its acceptance policy, its matrix set and its incumbent. */
export const routines = pgTable(
  'routines',
  {
    id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
    teamId: integer('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    slug: text('slug').notNull(),
    title: text('title').notNull(),
    description: text('description').notNull().default(''),
    contract: contractEnum('contract').notNull(),
    policy: jsonb('policy').$type<AcceptancePolicy>().notNull(),
    matrixSetId: integer('matrix_set_id')
      .notNull()
      .references(() => matrixSets.id),
    incumbentRevisionId: integer('incumbent_revision_id').references(
      (): AnyPgColumn => revisions.id,
    ),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex('routines_team_slug_key').on(t.teamId, t.slug)],
);
