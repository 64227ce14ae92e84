import type { Promotion } from '@shared/api/promotions.ts';
import type { PromotionListRow } from './promotions.repo.ts';

export function toPromotion(row: PromotionListRow): Promotion {
  const { promotion } = row;
  return {
    id: promotion.id,
    routineId: promotion.routineId,
    kind: promotion.kind,
    revisionId: promotion.revisionId,
    revisionNumber: row.revisionNumber,
    candidateId: row.candidateId,
    candidateTitle: row.candidateTitle,
    trialId: promotion.trialId,
    previousRevisionId: promotion.previousRevisionId,
    promotedBy: row.promotedBy,
    note: promotion.note,
    metricsSnapshot: promotion.metricsSnapshot,
    createdAt: promotion.createdAt.toISOString(),
  };
}
