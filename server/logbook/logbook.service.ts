import type { DriftCheck, Logbook, Tenure } from '@shared/api/logbook.ts';
import type { CurrentUser } from '@server/auth/current-user.ts';
import type { Db } from '@server/db/client.ts';
import { routineAccess } from '@server/candidates/candidate-access.ts';
import { toPromotion } from '@server/promotions/promotion-mapping.ts';
import { promotionsOf, type PromotionListRow } from '@server/promotions/promotions.repo.ts';
import { driftChecksOf, type DriftCheckRow } from './logbook.repo.ts';

function toDriftCheck(row: DriftCheckRow): DriftCheck {
  return {
    id: row.id,
    promotionId: row.promotionId,
    trialId: row.trialId,
    status: row.status,
    findings: row.findings,
    summary: row.summary,
    alertOpen: row.alertOpen,
    createdAt: row.createdAt.toISOString(),
    finishedAt: row.finishedAt?.toISOString() ?? null,
  };
}

/** Each promotion or reinstatement opens a tenure that the next one closes. */
function tenures(rows: readonly PromotionListRow[]): Tenure[] {
  return rows.map((row, i) => ({
    promotionId: row.promotion.id,
    revisionId: row.promotion.revisionId,
    revisionNumber: row.revisionNumber,
    candidateId: row.candidateId,
    candidateTitle: row.candidateTitle,
    trialId: row.promotion.trialId,
    from: row.promotion.createdAt.toISOString(),
    to: rows[i + 1]?.promotion.createdAt.toISOString() ?? null,
  }));
}

/**
 * A routine's history for its team: every promotion and reinstatement with its metrics
 * snapshot, each incumbent's tenure, and the scheduled re-runs of the incumbent (drift checks)
 * with their status and open alerts. Every point names the trial it rests on.
 */
export async function getLogbook(db: Db, user: CurrentUser, routineId: number): Promise<Logbook> {
  const { routine } = await routineAccess(db, user, routineId);
  const [promotions, checks] = await Promise.all([
    promotionsOf(db, routineId),
    driftChecksOf(db, routineId),
  ]);
  return {
    routine: {
      id: routine.id,
      teamId: routine.teamId,
      title: routine.title,
      contract: routine.contract,
      incumbentRevisionId: routine.incumbentRevisionId,
    },
    promotions: promotions.map(toPromotion),
    tenures: tenures(promotions),
    driftChecks: checks.map(toDriftCheck),
  };
}
