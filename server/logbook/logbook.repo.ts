import { asc, eq, sql } from 'drizzle-orm';
import { driftChecks } from '@server/db/schema/drift-checks.ts';
import type { DbOrTx } from '@server/mail/outbox.repo.ts';

export type DriftCheckRow = typeof driftChecks.$inferSelect;

/**
 * The drift-check read as a prepared statement, one per database handle (built once, planned
 * once per connection), as the trial report's reads are (trials.repo.ts): a logbook request
 * runs it on every call.
 */
function prepareDriftChecks(db: DbOrTx) {
  return db
    .select()
    .from(driftChecks)
    .where(eq(driftChecks.routineId, sql.placeholder('routineId')))
    .orderBy(asc(driftChecks.createdAt), asc(driftChecks.id))
    .prepare('logbook_drift_checks');
}

const prepared = new WeakMap<DbOrTx, ReturnType<typeof prepareDriftChecks>>();

/** A routine's drift checks, oldest first. */
export async function driftChecksOf(db: DbOrTx, routineId: number): Promise<DriftCheckRow[]> {
  let query = prepared.get(db);
  if (!query) {
    query = prepareDriftChecks(db);
    prepared.set(db, query);
  }
  return query.execute({ routineId });
}
