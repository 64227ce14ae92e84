import type { RoutineDetail, RoutineIncumbent } from '@shared/api/routines.ts';
import { contractTexts } from '@shared/contracts/contract-texts.ts';
import type { RoutineSlug } from '@shared/routines.ts';
import type { TeamRole } from '@shared/roles.ts';
import { readKernelSource } from '@sandbox/kernels/read-kernel-source.ts';
import { starterKernelFiles } from '@sandbox/kernels/starter-kernels.ts';
import type { Db } from '@server/db/client.ts';
import { findMatrixSet } from '@server/matrix-sets/matrix-sets.repo.ts';
import { headlineOf, incumbentPromotionByRoutine, summarizeRoutines } from './routine-summary.ts';
import { findIncumbentRevision, type RoutineRow } from './routines.repo.ts';

const starterSources = new Map<RoutineSlug, string>();

/** The starter kernel of a contract, read once from the engine's folder. */
function starterSource(contract: RoutineSlug): string {
  let source = starterSources.get(contract);
  if (source === undefined) {
    source = readKernelSource(starterKernelFiles[contract]);
    starterSources.set(contract, source);
  }
  return source;
}

async function incumbentOf(db: Db, routine: RoutineRow): Promise<RoutineIncumbent | null> {
  if (!routine.incumbentRevisionId) return null;
  const revision = await findIncumbentRevision(db, routine.incumbentRevisionId);
  const promotions = await incumbentPromotionByRoutine(db, [routine]);
  if (!revision) return null;
  const p = promotions.get(routine.id);
  return {
    ...revision,
    promotion: p
      ? {
          id: p.id,
          trialId: p.trialId,
          promotedBy: { id: p.promotedBy, login: p.promoterLogin },
          promotedAt: p.createdAt.toISOString(),
          headline: headlineOf(p.metricsSnapshot),
        }
      : null,
  };
}

/** Everything about a routine that an author needs to start a kernel for it. */
export async function routineDetail(
  db: Db,
  routine: RoutineRow,
  myRole: TeamRole,
): Promise<RoutineDetail> {
  // In turn, not at once: the demo loader calls createRoutine with its transaction as `db`,
  // and a transaction's one connection takes one query at a time.
  const [summary] = await summarizeRoutines(db, [routine]);
  const set = await findMatrixSet(db, routine.matrixSetId);
  const incumbent = await incumbentOf(db, routine);
  return {
    ...summary!,
    description: routine.description,
    myRole,
    contractText: contractTexts[routine.contract],
    starterSource: starterSource(routine.contract),
    policy: routine.policy,
    matrixSet: {
      id: routine.matrixSetId,
      name: set?.name ?? '',
      description: set?.description ?? '',
      itemCount: set?.itemCount ?? 0,
      timingSizes: set?.timingSizes ?? [],
    },
    incumbent,
    createdAt: routine.createdAt.toISOString(),
  };
}
