import { boolean, integer, pgTable, text, timestamp, uniqueIndex } from 'drizzle-orm/pg-core';

export const users = pgTable(
  'users',
  {
    id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
    githubId: text('github_id').notNull(),
    login: text('login').notNull(),
    displayName: text('display_name'),
    email: text('email'),
    isAdmin: boolean('is_admin').notNull().default(false),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex('users_github_id_key').on(t.githubId),
    uniqueIndex('users_login_key').on(t.login),
  ],
);
