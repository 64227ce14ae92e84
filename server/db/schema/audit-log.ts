import { index, integer, jsonb, pgTable, text, timestamp } from 'drizzle-orm/pg-core';
import { teams } from './teams.ts';
import { users } from './users.ts';

/** Every state change, who made it and when. */
export const auditLog = pgTable(
  'audit_log',
  {
    id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
    actorId: integer('actor_id').references(() => users.id),
    teamId: integer('team_id').references(() => teams.id, { onDelete: 'cascade' }),
    action: text('action').notNull(),
    entity: text('entity').notNull(),
    entityId: integer('entity_id'),
    details: jsonb('details').$type<Record<string, unknown>>().notNull().default({}),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index('audit_log_team_created_idx').on(t.teamId, t.createdAt),
    index('audit_log_entity_idx').on(t.entity, t.entityId),
  ],
);
