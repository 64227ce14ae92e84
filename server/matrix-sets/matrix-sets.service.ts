import type {
  MatrixSetDetail,
  MatrixSetInput,
  MatrixSetPage,
  MatrixSetSummary,
} from '@shared/api/matrix-sets.ts';
import type { PaginationQuery } from '@shared/api/pagination.ts';
import type { CurrentUser } from '@server/auth/current-user.ts';
import { recordAudit } from '@server/audit/audit.ts';
import type { Db } from '@server/db/client.ts';
import { AppError } from '@server/http/errors.ts';
import { requireTeamRole } from '@server/teams/team-access.ts';
import { isUniqueViolation } from '@server/teams/unique-violation.ts';
import { describeItem } from './matrix-item-description.ts';
import { checkMatrixSetItems } from './matrix-set-items.ts';
import { matrixSetEditors } from './matrix-sets.policy.ts';
import {
  countTrialsOn,
  deleteMatrixSet as deleteSetRow,
  findMatrixSet,
  insertMatrixSet,
  listItems,
  listTeamMatrixSets,
  lockTeamMatrixSet,
  replaceItems,
  routinesUsing,
  updateMatrixSet,
  type MatrixSetListRow,
} from './matrix-sets.repo.ts';

function toSummary(row: MatrixSetListRow): MatrixSetSummary {
  return {
    id: row.id,
    teamId: row.teamId,
    name: row.name,
    description: row.description,
    timingSizes: row.timingSizes,
    itemCount: row.itemCount,
    routineCount: row.routineCount,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}

/** The set and the caller's role in its team; 404 outside the team, as for a missing set. */
async function setAccess(db: Db, user: CurrentUser, id: number, editing: boolean) {
  const set = await findMatrixSet(db, id);
  if (!set) throw new AppError('not-found', 'No such matrix set.');
  await requireTeamRole(db, user, set.teamId, editing ? matrixSetEditors : undefined, 'matrix set');
  return set;
}

function nameTaken(name: string): AppError {
  return new AppError('conflict', `The team has a matrix set named ${name} already.`);
}

export async function listMatrixSets(
  db: Db,
  user: CurrentUser,
  teamId: number,
  page: PaginationQuery,
): Promise<MatrixSetPage> {
  await requireTeamRole(db, user, teamId);
  const { rows, total } = await listTeamMatrixSets(db, teamId, page);
  return { items: rows.map(toSummary), total, limit: page.limit, offset: page.offset };
}

export async function getMatrixSet(
  db: Db,
  user: CurrentUser,
  id: number,
): Promise<MatrixSetDetail> {
  const set = await setAccess(db, user, id, false);
  // In turn, not at once: the demo loader calls createMatrixSet with its transaction as `db`,
  // and a transaction's one connection takes one query at a time.
  const items = await listItems(db, id);
  const routines = await routinesUsing(db, id);
  return { ...toSummary(set), items: items.map(describeItem), routines };
}

/** Builds a set from generated recipes and the team's uploads (maintainers). */
export async function createMatrixSet(
  db: Db,
  user: CurrentUser,
  teamId: number,
  input: MatrixSetInput,
): Promise<MatrixSetDetail> {
  await requireTeamRole(db, user, teamId, matrixSetEditors);
  const items = await checkMatrixSetItems(db, teamId, input.items);
  const { items: _items, ...fields } = input;
  try {
    const id = await db.transaction(async (tx) => {
      const setId = await insertMatrixSet(tx, { teamId, ...fields });
      await replaceItems(tx, setId, items);
      await recordAudit(tx, {
        actorId: user.id,
        teamId,
        action: 'matrix-set.created',
        entity: 'matrix-set',
        entityId: setId,
        details: { name: input.name, items: items.length, timingSizes: input.timingSizes },
      });
      return setId;
    });
    return getMatrixSet(db, user, id);
  } catch (err) {
    if (isUniqueViolation(err, 'matrix_sets_team_name_key')) throw nameTaken(input.name);
    throw err;
  }
}

/**
 * Replaces a set's name, description, timing sizes and items (maintainers). Routines using the
 * set run their next trials on the new items; earlier trials keep their stored results.
 */
export async function replaceMatrixSet(
  db: Db,
  user: CurrentUser,
  id: number,
  input: MatrixSetInput,
): Promise<MatrixSetDetail> {
  const set = await setAccess(db, user, id, true);
  const items = await checkMatrixSetItems(db, set.teamId, input.items);
  const { items: _items, ...fields } = input;
  try {
    await db.transaction(async (tx) => {
      if (!(await lockTeamMatrixSet(tx, set.teamId, id))) {
        throw new AppError('not-found', 'No such matrix set.');
      }
      await updateMatrixSet(tx, id, fields);
      await replaceItems(tx, id, items);
      await recordAudit(tx, {
        actorId: user.id,
        teamId: set.teamId,
        action: 'matrix-set.replaced',
        entity: 'matrix-set',
        entityId: id,
        details: {
          name: input.name,
          items: { from: set.itemCount, to: items.length },
          timingSizes: { from: set.timingSizes, to: input.timingSizes },
        },
      });
    });
  } catch (err) {
    if (isUniqueViolation(err, 'matrix_sets_team_name_key')) throw nameTaken(input.name);
    throw err;
  }
  return getMatrixSet(db, user, id);
}

/**
 * Deletes a set no routine uses and no trial ran on (maintainers); otherwise 409, since a
 * routine needs its set and a trial's record refers to the set it ran on.
 */
export async function deleteMatrixSet(db: Db, user: CurrentUser, id: number): Promise<void> {
  const set = await setAccess(db, user, id, true);
  await db.transaction(async (tx) => {
    if (!(await lockTeamMatrixSet(tx, set.teamId, id))) {
      throw new AppError('not-found', 'No such matrix set.');
    }
    const users = await routinesUsing(tx, id);
    if (users.length > 0) {
      const titles = users.map((r) => r.title).join(', ');
      throw new AppError(
        'conflict',
        `The matrix set is in use by: ${titles}. Give them another set first.`,
      );
    }
    if ((await countTrialsOn(tx, id)) > 0) {
      throw new AppError(
        'conflict',
        'Trials have run on this matrix set; it is kept for their record.',
      );
    }
    await deleteSetRow(tx, set.teamId, id);
    await recordAudit(tx, {
      actorId: user.id,
      teamId: set.teamId,
      action: 'matrix-set.deleted',
      entity: 'matrix-set',
      entityId: id,
      details: { name: set.name },
    });
  });
}
