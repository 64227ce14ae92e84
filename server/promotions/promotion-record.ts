import { recordAudit } from '@server/audit/audit.ts';
import { setIncumbent, type RoutineRow } from '@server/candidates/candidates.repo.ts';
import type { MetricsSnapshot } from '@server/db/schema/promotions.ts';
import type { DbOrTx } from '@server/mail/outbox.repo.ts';
import { toMatrixReport, toTimingReport } from '@server/trials/trial-rows.ts';
import { matrixResultsOf, timingResultsOf } from '@server/trials/trials.repo.ts';
import { metricsSnapshot } from './metrics-snapshot.ts';
import { insertPromotion, type PromotionRow } from './promotions.repo.ts';

/** The metrics snapshot of a trial's stored results. */
export async function snapshotOfTrial(db: DbOrTx, trialId: number): Promise<MetricsSnapshot> {
  const matrices = await matrixResultsOf(db, trialId);
  const timing = await timingResultsOf(db, trialId);
  return metricsSnapshot(matrices.map(toMatrixReport), timing.map(toTimingReport));
}

export interface IncumbentChange {
  /** The routine, locked in this transaction. */
  routine: RoutineRow;
  kind: 'promote' | 'reinstate';
  revisionId: number;
  trialId: number;
  snapshot: MetricsSnapshot;
  actorId: number;
  note: string;
}

/**
 * Inside the caller's transaction: makes the revision the routine's incumbent, keeps the record
 * (who, which trial, the previous incumbent, the metrics) and writes the audit log.
 */
export async function changeIncumbent(tx: DbOrTx, change: IncumbentChange): Promise<PromotionRow> {
  const { routine } = change;
  await setIncumbent(tx, routine.id, change.revisionId);
  const promotion = await insertPromotion(tx, {
    routineId: routine.id,
    revisionId: change.revisionId,
    trialId: change.trialId,
    previousRevisionId: routine.incumbentRevisionId,
    kind: change.kind,
    promotedBy: change.actorId,
    note: change.note,
    metricsSnapshot: change.snapshot,
  });
  await recordAudit(tx, {
    actorId: change.actorId,
    teamId: routine.teamId,
    action: change.kind === 'promote' ? 'routine.promoted' : 'routine.reinstated',
    entity: 'routine',
    entityId: routine.id,
    details: {
      promotionId: promotion.id,
      revisionId: change.revisionId,
      previousRevisionId: routine.incumbentRevisionId,
      trialId: change.trialId,
    },
  });
  return promotion;
}
