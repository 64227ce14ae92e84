import { drizzle, type NodePgDatabase } from 'drizzle-orm/node-postgres';
import pg from 'pg';
import * as apiTokens from './schema/api-tokens.ts';
import * as auditLog from './schema/audit-log.ts';
import * as candidates from './schema/candidates.ts';
import * as comments from './schema/comments.ts';
import * as driftChecks from './schema/drift-checks.ts';
import * as emailOutbox from './schema/email-outbox.ts';
import * as invitations from './schema/invitations.ts';
import * as matrixSets from './schema/matrix-sets.ts';
import * as memberships from './schema/memberships.ts';
import * as promotions from './schema/promotions.ts';
import * as reviews from './schema/reviews.ts';
import * as revisions from './schema/revisions.ts';
import * as routines from './schema/routines.ts';
import * as teams from './schema/teams.ts';
import * as trialResults from './schema/trial-results.ts';
import * as trials from './schema/trials.ts';
import * as uploads from './schema/uploads.ts';
import * as userSessions from './schema/user-sessions.ts';
import * as users from './schema/users.ts';

export const schema = {
  ...users,
  ...teams,
  ...memberships,
  ...invitations,
  ...uploads,
  ...matrixSets,
  ...routines,
  ...candidates,
  ...revisions,
  ...trials,
  ...trialResults,
  ...comments,
  ...reviews,
  ...promotions,
  ...driftChecks,
  ...apiTokens,
  ...emailOutbox,
  ...auditLog,
  ...userSessions,
};
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
