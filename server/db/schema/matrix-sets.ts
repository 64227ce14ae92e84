import {
  index,
  integer,
  jsonb,
  pgEnum,
  pgTable,
  text,
  timestamp,
  uniqueIndex,
} from 'drizzle-orm/pg-core';
import { teams } from './teams.ts';
import { uploads } from './uploads.ts';

export const matrixSets = pgTable(
  'matrix_sets',
  {
    id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
    teamId: integer('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    description: text('description').notNull().default(''),
    timingSizes: jsonb('timing_sizes').$type<number[]>().notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex('matrix_sets_team_name_key').on(t.teamId, t.name)],
);

export const matrixSetItemKindEnum = pgEnum('matrix_set_item_kind', ['generated', 'upload']);

/** One matrix of a set: a generated family (recipe) or an uploaded file. */
export const matrixSetItems = pgTable(
  'matrix_set_items',
  {
    id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
    matrixSetId: integer('matrix_set_id')
      .notNull()
      .references(() => matrixSets.id, { onDelete: 'cascade' }),
    position: integer('position').notNull(),
    kind: matrixSetItemKindEnum('kind').notNull(),
    family: text('family'),
    n: integer('n'),
    m: integer('m'),
    seed: integer('seed'),
    params: jsonb('params').$type<Record<string, number>>(),
    uploadId: integer('upload_id').references(() => uploads.id, { onDelete: 'restrict' }),
  },
  (t) => [index('matrix_set_items_set_idx').on(t.matrixSetId, t.position)],
);
