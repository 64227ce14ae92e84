import { and, desc, eq, gt, inArray, isNotNull, isNull, sql } from 'drizzle-orm';
import type { DriftStatus } from '@shared/states.ts';
import { driftChecks } from '@server/db/schema/drift-checks.ts';
import { promotions } from '@server/db/schema/promotions.ts';
import { routines } from '@server/db/schema/routines.ts';
import { trials } from '@server/db/schema/trials.ts';
import type { DbOrTx } from '@server/mail/outbox.repo.ts';

export type DriftCheckRow = typeof driftChecks.$inferSelect;
export type PromotionRow = typeof promotions.$inferSelect;
export type RoutineRow = typeof routines.$inferSelect;

export async function routineIdsWithIncumbent(db: DbOrTx): Promise<number[]> {
  const rows = await db
    .select({ id: routines.id })
    .from(routines)
    .where(isNotNull(routines.incumbentRevisionId))
    .orderBy(routines.id);
  return rows.map((r) => r.id);
}

export async function findRoutine(db: DbOrTx, id: number): Promise<RoutineRow | null> {
  const [row] = await db.select().from(routines).where(eq(routines.id, id)).limit(1);
  return row ?? null;
}

export async function lockRoutine(tx: DbOrTx, id: number): Promise<RoutineRow | null> {
  const [row] = await tx.select().from(routines).where(eq(routines.id, id)).for('update');
  return row ?? null;
}

/** The newest promotion (or reinstatement) that made `revisionId` the routine's incumbent. */
export async function latestPromotionOf(
  db: DbOrTx,
  routineId: number,
  revisionId: number,
): Promise<PromotionRow | null> {
  const [row] = await db
    .select()
    .from(promotions)
    .where(and(eq(promotions.routineId, routineId), eq(promotions.revisionId, revisionId)))
    .orderBy(desc(promotions.createdAt), desc(promotions.id))
    .limit(1);
  return row ?? null;
}

export async function findPromotion(db: DbOrTx, id: number): Promise<PromotionRow | null> {
  const [row] = await db.select().from(promotions).where(eq(promotions.id, id)).limit(1);
  return row ?? null;
}

/**
 * Whether the routine has a drift check whose trial is still waiting or running. One older
 * than a day no longer counts (its job was lost), so a lost job cannot block checks for good.
 */
export async function hasPendingDriftCheck(db: DbOrTx, routineId: number): Promise<boolean> {
  const [row] = await db
    .select({ id: driftChecks.id })
    .from(driftChecks)
    .innerJoin(trials, eq(trials.id, driftChecks.trialId))
    .where(
      and(
        eq(driftChecks.routineId, routineId),
        isNull(driftChecks.status),
        inArray(trials.status, ['queued', 'running']),
        gt(driftChecks.createdAt, sql`now() - interval '1 day'`),
      ),
    )
    .limit(1);
  return row !== undefined;
}

/** A queued re-run of the incumbent (no incumbent beside it) and its drift check. */
export async function insertDriftCheck(
  tx: DbOrTx,
  routine: RoutineRow & { incumbentRevisionId: number },
  promotionId: number,
): Promise<{ driftCheckId: number; trialId: number }> {
  const [trial] = await tx
    .insert(trials)
    .values({
      routineId: routine.id,
      revisionId: routine.incumbentRevisionId,
      incumbentRevisionId: null,
      matrixSetId: routine.matrixSetId,
      purpose: 'drift-check',
      status: 'queued',
      progress: { phase: 'queued', done: 0, total: 0 },
    })
    .returning({ id: trials.id });
  const [check] = await tx
    .insert(driftChecks)
    .values({ routineId: routine.id, promotionId, trialId: trial!.id })
    .returning({ id: driftChecks.id });
  return { driftCheckId: check!.id, trialId: trial!.id };
}

export async function lockDriftCheckOfTrial(
  tx: DbOrTx,
  trialId: number,
): Promise<DriftCheckRow | null> {
  const [row] = await tx
    .select()
    .from(driftChecks)
    .where(eq(driftChecks.trialId, trialId))
    .for('update');
  return row ?? null;
}

export async function recordDriftResult(
  tx: DbOrTx,
  id: number,
  result: { status: DriftStatus; findings: string[]; summary: string; alertOpen: boolean },
): Promise<void> {
  await tx
    .update(driftChecks)
    .set({ ...result, finishedAt: sql`now()` })
    .where(eq(driftChecks.id, id));
}
