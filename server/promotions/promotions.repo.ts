import { asc, eq } from 'drizzle-orm';
import { candidates } from '@server/db/schema/candidates.ts';
import { promotions, type MetricsSnapshot } from '@server/db/schema/promotions.ts';
import { revisions } from '@server/db/schema/revisions.ts';
import { users } from '@server/db/schema/users.ts';
import { personColumns, type PersonRow } from '@server/candidates/candidates.repo.ts';
import type { DbOrTx } from '@server/mail/outbox.repo.ts';

export type PromotionRow = typeof promotions.$inferSelect;

export interface PromotionListRow {
  promotion: PromotionRow;
  revisionNumber: number;
  candidateId: number;
  candidateTitle: string;
  promotedBy: PersonRow;
}

function promotionRows(db: DbOrTx) {
  return db
    .select({
      promotion: promotions,
      revisionNumber: revisions.number,
      candidateId: candidates.id,
      candidateTitle: candidates.title,
      promotedBy: personColumns,
    })
    .from(promotions)
    .innerJoin(revisions, eq(revisions.id, promotions.revisionId))
    .innerJoin(candidates, eq(candidates.id, revisions.candidateId))
    .innerJoin(users, eq(users.id, promotions.promotedBy));
}

export async function findPromotion(db: DbOrTx, id: number): Promise<PromotionListRow | null> {
  const [row] = await promotionRows(db).where(eq(promotions.id, id)).limit(1);
  return row ?? null;
}

/** A routine's promotions and reinstatements, oldest first. */
export async function promotionsOf(db: DbOrTx, routineId: number): Promise<PromotionListRow[]> {
  return promotionRows(db)
    .where(eq(promotions.routineId, routineId))
    .orderBy(asc(promotions.createdAt), asc(promotions.id));
}

export async function insertPromotion(
  tx: DbOrTx,
  values: {
    routineId: number;
    revisionId: number;
    trialId: number;
    previousRevisionId: number | null;
    kind: 'promote' | 'reinstate';
    promotedBy: number;
    note: string;
    metricsSnapshot: MetricsSnapshot;
  },
): Promise<PromotionRow> {
  const [row] = await tx.insert(promotions).values(values).returning();
  return row!;
}
