import type { PaginationQuery } from '@shared/api/pagination.ts';
import type {
  CreateRoutine,
  RoutineDetail,
  RoutinePage,
  UpdateRoutine,
} from '@shared/api/routines.ts';
import { acceptancePolicySchema } from '@shared/acceptance-policy.ts';
import type { CurrentUser } from '@server/auth/current-user.ts';
import { recordAudit } from '@server/audit/audit.ts';
import type { Db } from '@server/db/client.ts';
import { AppError } from '@server/http/errors.ts';
import type { DbOrTx } from '@server/mail/outbox.repo.ts';
import { lockTeamMatrixSet } from '@server/matrix-sets/matrix-sets.repo.ts';
import { requireTeamRole } from '@server/teams/team-access.ts';
import { isUniqueViolation } from '@server/teams/unique-violation.ts';
import { routineDetail } from './routine-detail.ts';
import { summarizeRoutines } from './routine-summary.ts';
import { routineEditors } from './routines.policy.ts';
import {
  findRoutineRow,
  insertRoutine,
  listTeamRoutines,
  lockRoutineRow,
  updateRoutineRow,
} from './routines.repo.ts';

/** Holds the team's matrix set for the transaction (so it cannot be deleted under us), or 400. */
async function holdMatrixSet(tx: DbOrTx, teamId: number, matrixSetId: number): Promise<void> {
  if (!(await lockTeamMatrixSet(tx, teamId, matrixSetId, true))) {
    throw new AppError('validation-failed', 'The request is not valid.', [
      { path: 'matrixSetId', message: 'no matrix set of this team has this id' },
    ]);
  }
}

async function routineAccess(db: Db, user: CurrentUser, id: number, editing: boolean) {
  const routine = await findRoutineRow(db, id);
  if (!routine) throw new AppError('not-found', 'No such routine.');
  const role = await requireTeamRole(
    db,
    user,
    routine.teamId,
    editing ? routineEditors : undefined,
    'routine',
  );
  return { routine, role };
}

export async function listRoutines(
  db: Db,
  user: CurrentUser,
  teamId: number,
  page: PaginationQuery,
): Promise<RoutinePage> {
  await requireTeamRole(db, user, teamId);
  const { rows, total } = await listTeamRoutines(db, teamId, page);
  return {
    items: await summarizeRoutines(db, rows),
    total,
    limit: page.limit,
    offset: page.offset,
  };
}

export async function getRoutine(db: Db, user: CurrentUser, id: number): Promise<RoutineDetail> {
  const { routine, role } = await routineAccess(db, user, id, false);
  return routineDetail(db, routine, role);
}

/** A new routine of the team on one of its matrix sets (maintainers). */
export async function createRoutine(
  db: Db,
  user: CurrentUser,
  teamId: number,
  input: CreateRoutine,
): Promise<RoutineDetail> {
  const role = await requireTeamRole(db, user, teamId, routineEditors);
  try {
    const routine = await db.transaction(async (tx) => {
      await holdMatrixSet(tx, teamId, input.matrixSetId);
      const row = await insertRoutine(tx, { teamId, ...input });
      await recordAudit(tx, {
        actorId: user.id,
        teamId,
        action: 'routine.created',
        entity: 'routine',
        entityId: row.id,
        details: {
          slug: row.slug,
          contract: row.contract,
          matrixSetId: row.matrixSetId,
          policy: row.policy,
        },
      });
      return row;
    });
    return routineDetail(db, routine, role);
  } catch (err) {
    if (isUniqueViolation(err, 'routines_team_slug_key')) {
      throw new AppError('conflict', `The team has a routine with the slug ${input.slug} already.`);
    }
    throw err;
  }
}

/**
 * Changes a routine's title, description, matrix set or acceptance policy (maintainers). Policy
 * changes name only the thresholds that change; the audit log keeps each field's old and new
 * value.
 */
export async function updateRoutine(
  db: Db,
  user: CurrentUser,
  id: number,
  input: UpdateRoutine,
): Promise<RoutineDetail> {
  const { role } = await routineAccess(db, user, id, true);
  const updated = await db.transaction(async (tx) => {
    const routine = await lockRoutineRow(tx, id);
    if (!routine) throw new AppError('not-found', 'No such routine.');
    if (input.matrixSetId !== undefined) await holdMatrixSet(tx, routine.teamId, input.matrixSetId);
    const next = {
      title: input.title ?? routine.title,
      description: input.description ?? routine.description,
      matrixSetId: input.matrixSetId ?? routine.matrixSetId,
      policy: acceptancePolicySchema.parse({ ...routine.policy, ...input.policy }),
    };
    const changes = Object.fromEntries(
      (Object.keys(next) as (keyof typeof next)[])
        .filter((k) => JSON.stringify(next[k]) !== JSON.stringify(routine[k]))
        .map((k) => [k, { from: routine[k], to: next[k] }]),
    );
    if (Object.keys(changes).length === 0) return routine;
    await updateRoutineRow(tx, id, next);
    await recordAudit(tx, {
      actorId: user.id,
      teamId: routine.teamId,
      action: 'routine.updated',
      entity: 'routine',
      entityId: id,
      details: { changes },
    });
    return { ...routine, ...next };
  });
  return routineDetail(db, updated, role);
}
