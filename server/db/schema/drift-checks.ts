import {
  boolean,
  index,
  integer,
  jsonb,
  pgEnum,
  pgTable,
  text,
  timestamp,
} from 'drizzle-orm/pg-core';
import { driftStatuses } from '@shared/states.ts';
import { promotions } from './promotions.ts';
import { routines } from './routines.ts';
import { trials } from './trials.ts';

export const driftStatusEnum = pgEnum('drift_status', driftStatuses);

/** A scheduled re-run of a routine's incumbent, compared with its promotion's snapshot. */
export const driftChecks = pgTable(
  'drift_checks',
  {
    id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
    routineId: integer('routine_id')
      .notNull()
      .references(() => routines.id, { onDelete: 'cascade' }),
    promotionId: integer('promotion_id')
      .notNull()
      .references(() => promotions.id),
    trialId: integer('trial_id').references(() => trials.id),
    status: driftStatusEnum('status'),
    /** Plain-words findings: which size or metric moved, by how much. */
    findings: jsonb('findings').$type<string[]>().notNull().default([]),
    summary: text('summary'),
    alertOpen: boolean('alert_open').notNull().default(false),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    finishedAt: timestamp('finished_at', { withTimezone: true }),
  },
  (t) => [index('drift_checks_routine_created_idx').on(t.routineId, t.createdAt)],
);
