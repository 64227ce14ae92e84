import { index, integer, pgEnum, pgTable, primaryKey, timestamp } from 'drizzle-orm/pg-core';
import { teamRoles } from '@shared/roles.ts';
import { teams } from './teams.ts';
import { users } from './users.ts';

export const teamRoleEnum = pgEnum('team_role', teamRoles);

export const memberships = pgTable(
  'memberships',
  {
    teamId: integer('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    userId: integer('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    role: teamRoleEnum('role').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    primaryKey({ columns: [t.teamId, t.userId] }),
    index('memberships_user_idx').on(t.userId),
  ],
);
