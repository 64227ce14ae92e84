import { asc, eq } from 'drizzle-orm';
import { driftChecks } from '@server/db/schema/drift-checks.ts';
import type { DbOrTx } from '@server/mail/outbox.repo.ts';

export type DriftCheckRow = typeof driftChecks.$inferSelect;

/** A routine's drift checks, oldest first. */
export async function driftChecksOf(db: DbOrTx, routineId: number): Promise<DriftCheckRow[]> {
  return db
    .select()
    .from(driftChecks)
    .where(eq(driftChecks.routineId, routineId))
    .orderBy(asc(driftChecks.createdAt), asc(driftChecks.id));
}
