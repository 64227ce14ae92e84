import { index, json, pgTable, timestamp, varchar } from 'drizzle-orm/pg-core';

/** express-session's store, in the shape connect-pg-simple reads and writes. */
export const userSessions = pgTable(
  'user_sessions',
  {
    sid: varchar('sid').primaryKey(),
    sess: json('sess').notNull(),
    expire: timestamp('expire', { precision: 6 }).notNull(),
  },
  (t) => [index('user_sessions_expire_idx').on(t.expire)],
);
