import { and, asc, count, eq, inArray } from 'drizzle-orm';
import type { Db } from '@server/db/client.ts';
import { matrixSetItems, matrixSets } from '@server/db/schema/matrix-sets.ts';
import { routines } from '@server/db/schema/routines.ts';
import { trials } from '@server/db/schema/trials.ts';
import { uploads } from '@server/db/schema/uploads.ts';
import type { DbOrTx } from '@server/mail/outbox.repo.ts';

export type MatrixSetRow = typeof matrixSets.$inferSelect;
export type NewMatrixSetItem = Omit<
  typeof matrixSetItems.$inferInsert,
  'id' | 'matrixSetId' | 'position'
>;
export interface MatrixSetListRow extends MatrixSetRow {
  itemCount: number;
  routineCount: number;
}

/** Adds each set's item count and the number of routines using it. */
async function withCounts(db: DbOrTx, rows: MatrixSetRow[]): Promise<MatrixSetListRow[]> {
  const ids = rows.map((r) => r.id);
  if (ids.length === 0) return [];
  const [items, users] = await Promise.all([
    db
      .select({ id: matrixSetItems.matrixSetId, n: count() })
      .from(matrixSetItems)
      .where(inArray(matrixSetItems.matrixSetId, ids))
      .groupBy(matrixSetItems.matrixSetId),
    db
      .select({ id: routines.matrixSetId, n: count() })
      .from(routines)
      .where(inArray(routines.matrixSetId, ids))
      .groupBy(routines.matrixSetId),
  ]);
  const itemCounts = new Map(items.map((r) => [r.id, r.n]));
  const routineCounts = new Map(users.map((r) => [r.id, r.n]));
  return rows.map((r) => ({
    ...r,
    itemCount: itemCounts.get(r.id) ?? 0,
    routineCount: routineCounts.get(r.id) ?? 0,
  }));
}

export async function findMatrixSet(db: DbOrTx, id: number): Promise<MatrixSetListRow | null> {
  const rows = await db.select().from(matrixSets).where(eq(matrixSets.id, id)).limit(1);
  return (await withCounts(db, rows))[0] ?? null;
}

/** The set if it belongs to the team, else null (another team's answers like a missing one). */
export async function findTeamMatrixSet(db: DbOrTx, teamId: number, id: number) {
  const row = await findMatrixSet(db, id);
  return row && row.teamId === teamId ? row : null;
}

/** A page of a team's matrix sets by name. */
export async function listTeamMatrixSets(
  db: Db,
  teamId: number,
  page: { limit: number; offset: number },
): Promise<{ rows: MatrixSetListRow[]; total: number }> {
  const [rows, [totals]] = await Promise.all([
    db
      .select()
      .from(matrixSets)
      .where(eq(matrixSets.teamId, teamId))
      .orderBy(asc(matrixSets.name), asc(matrixSets.id))
      .limit(page.limit)
      .offset(page.offset),
    db.select({ total: count() }).from(matrixSets).where(eq(matrixSets.teamId, teamId)),
  ]);
  return { rows: await withCounts(db, rows), total: totals?.total ?? 0 };
}

export async function insertMatrixSet(
  tx: DbOrTx,
  values: { teamId: number; name: string; description: string; timingSizes: number[] },
): Promise<number> {
  const [row] = await tx.insert(matrixSets).values(values).returning({ id: matrixSets.id });
  return row!.id;
}

export async function updateMatrixSet(
  tx: DbOrTx,
  id: number,
  values: { name: string; description: string; timingSizes: number[] },
): Promise<void> {
  await tx
    .update(matrixSets)
    .set({ ...values, updatedAt: new Date() })
    .where(eq(matrixSets.id, id));
}

/** Replaces every item of a set with `items`, in order. */
export async function replaceItems(tx: DbOrTx, setId: number, items: NewMatrixSetItem[]) {
  await tx.delete(matrixSetItems).where(eq(matrixSetItems.matrixSetId, setId));
  if (items.length === 0) return;
  await tx
    .insert(matrixSetItems)
    .values(items.map((item, position) => ({ ...item, matrixSetId: setId, position })));
}

/** A set's items in order, with the file's name and shape for uploaded ones. */
export function listItems(db: DbOrTx, setId: number) {
  return db
    .select({
      position: matrixSetItems.position,
      kind: matrixSetItems.kind,
      family: matrixSetItems.family,
      n: matrixSetItems.n,
      m: matrixSetItems.m,
      seed: matrixSetItems.seed,
      params: matrixSetItems.params,
      uploadId: matrixSetItems.uploadId,
      fileName: uploads.fileName,
      fileRows: uploads.rows,
      fileCols: uploads.cols,
      fileEntries: uploads.entries,
      fileSymmetry: uploads.symmetry,
    })
    .from(matrixSetItems)
    .leftJoin(uploads, eq(uploads.id, matrixSetItems.uploadId))
    .where(eq(matrixSetItems.matrixSetId, setId))
    .orderBy(asc(matrixSetItems.position));
}
export type MatrixSetItemRow = Awaited<ReturnType<typeof listItems>>[number];

export function routinesUsing(db: DbOrTx, setId: number) {
  return db
    .select({ id: routines.id, title: routines.title })
    .from(routines)
    .where(eq(routines.matrixSetId, setId))
    .orderBy(asc(routines.title), asc(routines.id));
}

export async function countTrialsOn(tx: DbOrTx, setId: number): Promise<number> {
  const [row] = await tx.select({ n: count() }).from(trials).where(eq(trials.matrixSetId, setId));
  return row?.n ?? 0;
}

/** The set row locked until the transaction ends, when it is the team's. */
export async function lockTeamMatrixSet(tx: DbOrTx, teamId: number, id: number, share = false) {
  const [row] = await tx
    .select({ id: matrixSets.id })
    .from(matrixSets)
    .where(and(eq(matrixSets.id, id), eq(matrixSets.teamId, teamId)))
    .for(share ? 'share' : 'update');
  return row ?? null;
}

export async function deleteMatrixSet(tx: DbOrTx, teamId: number, id: number): Promise<void> {
  await tx.delete(matrixSets).where(and(eq(matrixSets.id, id), eq(matrixSets.teamId, teamId)));
}
