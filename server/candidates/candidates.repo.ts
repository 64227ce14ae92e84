import { and, count, desc, eq, sql, type SQL } from 'drizzle-orm';
import type { CandidateState } from '@shared/states.ts';
import { candidates } from '@server/db/schema/candidates.ts';
import { revisions } from '@server/db/schema/revisions.ts';
import { routines } from '@server/db/schema/routines.ts';
import { users } from '@server/db/schema/users.ts';
import type { DbOrTx } from '@server/mail/outbox.repo.ts';

export type CandidateRow = typeof candidates.$inferSelect;
export type RoutineRow = typeof routines.$inferSelect;

/** A person as rows carry them: the display name may be missing. */
export const personColumns = { id: users.id, login: users.login, name: users.displayName };
export interface PersonRow {
  id: number;
  login: string;
  name: string | null;
}

export async function findRoutine(db: DbOrTx, id: number): Promise<RoutineRow | null> {
  const [row] = await db.select().from(routines).where(eq(routines.id, id)).limit(1);
  return row ?? null;
}

/** The routine row, locked until the transaction ends (its incumbent is about to change). */
export async function lockRoutine(tx: DbOrTx, id: number): Promise<RoutineRow | null> {
  const [row] = await tx.select().from(routines).where(eq(routines.id, id)).for('update');
  return row ?? null;
}

export async function setIncumbent(tx: DbOrTx, routineId: number, revisionId: number) {
  await tx
    .update(routines)
    .set({ incumbentRevisionId: revisionId })
    .where(eq(routines.id, routineId));
}

export async function findCandidate(db: DbOrTx, id: number): Promise<CandidateRow | null> {
  const [row] = await db.select().from(candidates).where(eq(candidates.id, id)).limit(1);
  return row ?? null;
}

/** The candidate row, locked until the transaction ends, so state changes happen one at a time. */
export async function lockCandidate(tx: DbOrTx, id: number): Promise<CandidateRow> {
  const [row] = await tx.select().from(candidates).where(eq(candidates.id, id)).for('update');
  if (!row) throw new Error(`candidate ${id} vanished inside its transaction`);
  return row;
}

export async function insertCandidate(
  tx: DbOrTx,
  values: { routineId: number; authorId: number; title: string; description: string },
): Promise<CandidateRow> {
  const [row] = await tx.insert(candidates).values(values).returning();
  return row!;
}

export async function setCandidateState(
  tx: DbOrTx,
  id: number,
  state: CandidateState,
): Promise<CandidateRow> {
  const [row] = await tx
    .update(candidates)
    .set({ state, updatedAt: sql`now()` })
    .where(eq(candidates.id, id))
    .returning();
  return row!;
}

const latestRevisionNumber =
  sql<number>`(select coalesce(max(${revisions.number}), 0) from ${revisions} where ${revisions.candidateId} = ${candidates.id})`.mapWith(
    Number,
  );

export interface CandidateListRow {
  candidate: CandidateRow;
  author: PersonRow;
  latestRevision: number;
}

function summaries(db: DbOrTx, where: SQL | undefined) {
  return db
    .select({ candidate: candidates, author: personColumns, latestRevision: latestRevisionNumber })
    .from(candidates)
    .innerJoin(users, eq(users.id, candidates.authorId))
    .where(where);
}

export async function findCandidateSummary(
  db: DbOrTx,
  id: number,
): Promise<CandidateListRow | null> {
  const [row] = await summaries(db, eq(candidates.id, id)).limit(1);
  return row ?? null;
}

/** A page of a routine's candidates, most recently changed first, optionally in one state. */
export async function listCandidateRows(
  db: DbOrTx,
  routineId: number,
  query: { state?: CandidateState | undefined; limit: number; offset: number },
): Promise<{ rows: CandidateListRow[]; total: number }> {
  const where = and(
    eq(candidates.routineId, routineId),
    query.state ? eq(candidates.state, query.state) : undefined,
  );
  const [rows, [totals]] = await Promise.all([
    summaries(db, where)
      .orderBy(desc(candidates.updatedAt), desc(candidates.id))
      .limit(query.limit)
      .offset(query.offset),
    db.select({ total: count() }).from(candidates).where(where),
  ]);
  return { rows, total: totals?.total ?? 0 };
}
