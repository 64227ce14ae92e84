import {
  openCandidateStates,
  type IncumbentHeadline,
  type OpenCandidateCounts,
  type RoutineSummary,
} from '@shared/api/routines.ts';
import type { MetricsSnapshot } from '@server/db/schema/promotions.ts';
import type { Db } from '@server/db/client.ts';
import {
  incumbentPromotions,
  openCandidateCounts,
  type IncumbentPromotionRow,
  type RoutineRow,
} from './routines.repo.ts';

/** The worst factor ratio and the median time at the largest timing size of a snapshot. */
export function headlineOf(snapshot: MetricsSnapshot): IncumbentHeadline {
  const largest = snapshot.timing.reduce<MetricsSnapshot['timing'][number] | null>(
    (best, t) => (best === null || t.n > best.n ? t : best),
    null,
  );
  return {
    worstFactorRatio: snapshot.worstFactorRatio,
    timingN: largest?.n ?? null,
    timingMedianMs: largest?.medianMs ?? null,
  };
}

/** For each routine, the newest promotion of its incumbent revision. */
export async function incumbentPromotionByRoutine(
  db: Db,
  rows: RoutineRow[],
): Promise<Map<number, IncumbentPromotionRow>> {
  const incumbents = rows.flatMap((r) => (r.incumbentRevisionId ? [r.incumbentRevisionId] : []));
  const found = await incumbentPromotions(
    db,
    rows.map((r) => r.id),
    incumbents,
  );
  const byRoutine = new Map<number, IncumbentPromotionRow>();
  const incumbentOf = new Map(rows.map((r) => [r.id, r.incumbentRevisionId]));
  for (const p of found) {
    if (incumbentOf.get(p.routineId) === p.revisionId && !byRoutine.has(p.routineId)) {
      byRoutine.set(p.routineId, p);
    }
  }
  return byRoutine;
}

function zeroCounts(): OpenCandidateCounts {
  return Object.fromEntries(openCandidateStates.map((s) => [s, 0])) as OpenCandidateCounts;
}

/** Routines as listed: headline figures of the incumbent and open candidates per state. */
export async function summarizeRoutines(db: Db, rows: RoutineRow[]): Promise<RoutineSummary[]> {
  const ids = rows.map((r) => r.id);
  // In turn, not at once: `db` may be a transaction (routine-detail.ts).
  const promotionsByRoutine = await incumbentPromotionByRoutine(db, rows);
  const counts = await openCandidateCounts(db, ids);
  const countsByRoutine = new Map(ids.map((id) => [id, zeroCounts()]));
  for (const c of counts) {
    const entry = countsByRoutine.get(c.routineId);
    if (entry && c.state in entry) entry[c.state as keyof OpenCandidateCounts] = c.n;
  }
  return rows.map((r) => {
    const promotion = promotionsByRoutine.get(r.id);
    return {
      id: r.id,
      teamId: r.teamId,
      slug: r.slug,
      title: r.title,
      contract: r.contract,
      matrixSetId: r.matrixSetId,
      incumbentRevisionId: r.incumbentRevisionId,
      incumbent: promotion
        ? {
            candidateId: promotion.candidateId,
            candidateTitle: promotion.candidateTitle,
            revisionNumber: promotion.revisionNumber,
          }
        : null,
      headline: promotion ? headlineOf(promotion.metricsSnapshot) : null,
      openCandidates: countsByRoutine.get(r.id) ?? zeroCounts(),
    };
  });
}
