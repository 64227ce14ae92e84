import { index, integer, pgTable, text, timestamp } from 'drizzle-orm/pg-core';
import { teams } from './teams.ts';
import { users } from './users.ts';

/** Matrix Market files uploaded by a team, kept whole with what parsing found. */
export const uploads = pgTable(
  'uploads',
  {
    id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
    teamId: integer('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    fileName: text('file_name').notNull(),
    content: text('content').notNull(),
    bytes: integer('bytes').notNull(),
    rows: integer('rows').notNull(),
    cols: integer('cols').notNull(),
    entries: integer('entries').notNull(),
    symmetry: text('symmetry').notNull(),
    field: text('field').notNull(),
    format: text('format').notNull(),
    uploadedBy: integer('uploaded_by')
      .notNull()
      .references(() => users.id),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('uploads_team_idx').on(t.teamId)],
);
