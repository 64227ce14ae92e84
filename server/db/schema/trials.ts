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
import type { Machine, PhaseTimes, TrialReport } from '@shared/trial-report.ts';
import { trialPurposes, trialStatuses } from '@shared/states.ts';
import { matrixSets } from './matrix-sets.ts';
import { revisions } from './revisions.ts';
import { routines } from './routines.ts';

export const trialStatusEnum = pgEnum('trial_status', trialStatuses);
export const trialPurposeEnum = pgEnum('trial_purpose', trialPurposes);

export interface TrialProgressRecord {
  phase: 'queued' | 'compile' | 'accuracy' | 'timing' | 'verdict' | 'done';
  done: number;
  total: number;
  label?: string;
}

/** One evaluation of a revision against a matrix set, beside the incumbent of the time. */
export const trials = pgTable(
  'trials',
  {
    id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
    routineId: integer('routine_id')
      .notNull()
      .references(() => routines.id, { onDelete: 'cascade' }),
    revisionId: integer('revision_id')
      .notNull()
      .references(() => revisions.id, { onDelete: 'cascade' }),
    incumbentRevisionId: integer('incumbent_revision_id').references(() => revisions.id),
    matrixSetId: integer('matrix_set_id')
      .notNull()
      .references(() => matrixSets.id),
    purpose: trialPurposeEnum('purpose').notNull().default('candidate'),
    status: trialStatusEnum('status').notNull().default('queued'),
    progress: jsonb('progress').$type<TrialProgressRecord>().notNull(),
    /** Times the worker has started this trial (a crash and retry starts it afresh). */
    attempts: integer('attempts').notNull().default(0),
    machine: jsonb('machine').$type<Machine>(),
    phases: jsonb('phases').$type<PhaseTimes>(),
    verdict: jsonb('verdict').$type<TrialReport['verdict']>(),
    passed: boolean('passed'),
    message: text('message'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    startedAt: timestamp('started_at', { withTimezone: true }),
    finishedAt: timestamp('finished_at', { withTimezone: true }),
  },
  (t) => [
    index('trials_revision_idx').on(t.revisionId),
    index('trials_routine_created_idx').on(t.routineId, t.createdAt),
    index('trials_status_idx').on(t.status),
  ],
);
