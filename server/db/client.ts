import { drizzle, type NodePgDatabase } from 'drizzle-orm/node-postgres';
import pg from 'pg';
import * as users from './schema/users.ts';
import * as teams from './schema/teams.ts';
import * as memberships from './schema/memberships.ts';

export const schema = { ...users, ...teams, ...memberships };
export type Db = NodePgDatabase<typeof schema>;

export interface Database {
  pool: pg.Pool;
  db: Db;
}

/** One pool per process; Drizzle on top of it. */
export function createDatabase(url: string, max = 10): Database {
  const pool = new pg.Pool({ connectionString: url, max, connectionTimeoutMillis: 5000 });
  // An idle client losing its connection must not crash the process.
  pool.on('error', () => {});
  return { pool, db: drizzle(pool, { schema }) };
}
