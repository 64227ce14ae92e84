import {
  boolean,
  doublePrecision,
  integer,
  jsonb,
  pgTable,
  text,
  uniqueIndex,
} from 'drizzle-orm/pg-core';
import type { KernelOutcome } from '@shared/trial-report.ts';
import { trials } from './trials.ts';

/** Per-matrix results of a trial, written in one transaction with the trial's verdict. */
export const trialMatrixResults = pgTable(
  'trial_matrix_results',
  {
    id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
    trialId: integer('trial_id')
      .notNull()
      .references(() => trials.id, { onDelete: 'cascade' }),
    position: integer('position').notNull(),
    matrixId: text('matrix_id').notNull(),
    family: text('family').notNull(),
    m: integer('m').notNull(),
    n: integer('n').notNull(),
    condition: doublePrecision('condition'),
    conditionKind: text('condition_kind'),
    /** The reference solver's growth factor on this matrix; null where the routine has none. */
    referenceGrowth: doublePrecision('reference_growth'),
    expected: text('expected').notNull(),
    referenceTrusted: boolean('reference_trusted').notNull(),
    note: text('note').notNull(),
    /** Kernel outcomes; non-finite metric values are stored as the strings "Infinity"/"NaN". */
    candidate: jsonb('candidate').$type<KernelOutcome>().notNull(),
    incumbent: jsonb('incumbent').$type<KernelOutcome>(),
    passed: boolean('passed').notNull(),
    failures: jsonb('failures').$type<string[]>().notNull(),
  },
  (t) => [uniqueIndex('trial_matrix_results_trial_matrix_key').on(t.trialId, t.matrixId)],
);

/** Per-size timing results of a trial. */
export const trialTimingResults = pgTable(
  'trial_timing_results',
  {
    id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
    trialId: integer('trial_id')
      .notNull()
      .references(() => trials.id, { onDelete: 'cascade' }),
    n: integer('n').notNull(),
    rounds: integer('rounds').notNull(),
    candidateMs: doublePrecision('candidate_ms'),
    incumbentMs: doublePrecision('incumbent_ms'),
    ratio: doublePrecision('ratio'),
    ciLow: doublePrecision('ci_low'),
    ciHigh: doublePrecision('ci_high'),
    verdict: text('verdict'),
    /** The full TimingReport (quartiles, GFLOP/s, flags, message). */
    detail: jsonb('detail').notNull(),
  },
  (t) => [uniqueIndex('trial_timing_results_trial_n_key').on(t.trialId, t.n)],
);
