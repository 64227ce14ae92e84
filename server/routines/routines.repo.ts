import { and, asc, count, desc, eq, inArray, notInArray } from 'drizzle-orm';
import type { AcceptancePolicy } from '@shared/acceptance-policy.ts';
import type { RoutineSlug } from '@shared/routines.ts';
import type { CandidateState } from '@shared/states.ts';
import type { Db } from '@server/db/client.ts';
import { candidates } from '@server/db/schema/candidates.ts';
import { promotions } from '@server/db/schema/promotions.ts';
import { revisions } from '@server/db/schema/revisions.ts';
import { routines } from '@server/db/schema/routines.ts';
import { users } from '@server/db/schema/users.ts';
import type { DbOrTx } from '@server/mail/outbox.repo.ts';

export type RoutineRow = typeof routines.$inferSelect;

export async function findRoutineRow(db: DbOrTx, id: number): Promise<RoutineRow | null> {
  const [row] = await db.select().from(routines).where(eq(routines.id, id)).limit(1);
  return row ?? null;
}

/** The routine row locked until the transaction ends (a change to it is under way). */
export async function lockRoutineRow(tx: DbOrTx, id: number): Promise<RoutineRow | null> {
  const [row] = await tx.select().from(routines).where(eq(routines.id, id)).for('update');
  return row ?? null;
}

/** A page of a team's routines by title. */
export async function listTeamRoutines(
  db: Db,
  teamId: number,
  page: { limit: number; offset: number },
): Promise<{ rows: RoutineRow[]; total: number }> {
  const [rows, [totals]] = await Promise.all([
    db
      .select()
      .from(routines)
      .where(eq(routines.teamId, teamId))
      .orderBy(asc(routines.title), asc(routines.id))
      .limit(page.limit)
      .offset(page.offset),
    db.select({ total: count() }).from(routines).where(eq(routines.teamId, teamId)),
  ]);
  return { rows, total: totals?.total ?? 0 };
}

export async function insertRoutine(
  tx: DbOrTx,
  values: {
    teamId: number;
    slug: string;
    title: string;
    description: string;
    contract: RoutineSlug;
    policy: AcceptancePolicy;
    matrixSetId: number;
  },
): Promise<RoutineRow> {
  const [row] = await tx.insert(routines).values(values).returning();
  return row!;
}

export async function updateRoutineRow(
  tx: DbOrTx,
  id: number,
  values: Partial<Pick<RoutineRow, 'title' | 'description' | 'policy' | 'matrixSetId'>>,
): Promise<void> {
  await tx.update(routines).set(values).where(eq(routines.id, id));
}

/** Candidates not promoted or withdrawn, counted per routine and state. */
export function openCandidateCounts(db: Db, routineIds: number[]) {
  if (routineIds.length === 0) return Promise.resolve([]);
  const closed: CandidateState[] = ['promoted', 'withdrawn'];
  return db
    .select({ routineId: candidates.routineId, state: candidates.state, n: count() })
    .from(candidates)
    .where(and(inArray(candidates.routineId, routineIds), notInArray(candidates.state, closed)))
    .groupBy(candidates.routineId, candidates.state);
}

/**
 * The promotions that made the given revisions incumbent of these routines, newest first, with
 * who promoted them (a revision promoted, replaced and reinstated has several; the newest counts).
 */
export function incumbentPromotions(db: Db, routineIds: number[], revisionIds: number[]) {
  if (routineIds.length === 0 || revisionIds.length === 0) return Promise.resolve([]);
  return db
    .select({
      id: promotions.id,
      routineId: promotions.routineId,
      revisionId: promotions.revisionId,
      trialId: promotions.trialId,
      metricsSnapshot: promotions.metricsSnapshot,
      createdAt: promotions.createdAt,
      promotedBy: promotions.promotedBy,
      promoterLogin: users.login,
      revisionNumber: revisions.number,
      candidateId: candidates.id,
      candidateTitle: candidates.title,
    })
    .from(promotions)
    .innerJoin(users, eq(users.id, promotions.promotedBy))
    .innerJoin(revisions, eq(revisions.id, promotions.revisionId))
    .innerJoin(candidates, eq(candidates.id, revisions.candidateId))
    .where(
      and(inArray(promotions.routineId, routineIds), inArray(promotions.revisionId, revisionIds)),
    )
    .orderBy(desc(promotions.createdAt), desc(promotions.id));
}
export type IncumbentPromotionRow = Awaited<ReturnType<typeof incumbentPromotions>>[number];

/** The incumbent revision's number and its candidate. */
export async function findIncumbentRevision(db: Db, revisionId: number) {
  const [row] = await db
    .select({
      revisionId: revisions.id,
      revisionNumber: revisions.number,
      candidateId: candidates.id,
      candidateTitle: candidates.title,
    })
    .from(revisions)
    .innerJoin(candidates, eq(candidates.id, revisions.candidateId))
    .where(eq(revisions.id, revisionId))
    .limit(1);
  return row ?? null;
}
