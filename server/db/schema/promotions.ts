import { index, integer, jsonb, pgEnum, pgTable, text, timestamp } from 'drizzle-orm/pg-core';
import { promotionKinds } from '@shared/states.ts';
import { revisions } from './revisions.ts';
import { routines } from './routines.ts';
import { trials } from './trials.ts';
import { users } from './users.ts';

export const promotionKindEnum = pgEnum('promotion_kind', promotionKinds);

/** Metrics kept with a promotion, so later drift checks compare against them. */
export interface MetricsSnapshot {
  worstFactorRatio: number | null;
  worstForwardErrorOverBound: number | null;
  timing: { n: number; medianMs: number | null; gflops: number | null }[];
}

/** Who made which revision the incumbent, when, on which trial's evidence. */
export const promotions = pgTable(
  'promotions',
  {
    id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
    routineId: integer('routine_id')
      .notNull()
      .references(() => routines.id, { onDelete: 'cascade' }),
    revisionId: integer('revision_id')
      .notNull()
      .references(() => revisions.id),
    trialId: integer('trial_id')
      .notNull()
      .references(() => trials.id),
    previousRevisionId: integer('previous_revision_id').references(() => revisions.id),
    kind: promotionKindEnum('kind').notNull(),
    promotedBy: integer('promoted_by')
      .notNull()
      .references(() => users.id),
    note: text('note').notNull(),
    metricsSnapshot: jsonb('metrics_snapshot').$type<MetricsSnapshot>().notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('promotions_routine_created_idx').on(t.routineId, t.createdAt)],
);
