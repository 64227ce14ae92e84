import { asc, eq, inArray } from 'drizzle-orm';
import { generateMatrix } from '@sandbox/matrices/generate.ts';
import type { FamilySlug, ReferenceMatrix } from '@sandbox/matrices/reference-matrix.ts';
import { parseMatrixMarket } from '@sandbox/matrix-market/read.ts';
import { matrixFromFile } from '@sandbox/trial/file-matrix.ts';
import type { Db } from '@server/db/client.ts';
import { matrixSetItems } from '@server/db/schema/matrix-sets.ts';
import { uploads } from '@server/db/schema/uploads.ts';
import { TrialCannotRun } from './trial-cannot-run.ts';

type ItemRow = typeof matrixSetItems.$inferSelect;

function generated(item: ItemRow, index: number): ReferenceMatrix {
  if (item.family === null || item.n === null) {
    throw new TrialCannotRun(`matrix ${index + 1} of the set has no family or order`);
  }
  try {
    return generateMatrix({
      family: item.family as FamilySlug,
      n: item.n,
      ...(item.m !== null ? { m: item.m } : {}),
      ...(item.seed !== null ? { seed: item.seed } : {}),
      ...(item.params !== null ? { params: item.params } : {}),
    });
  } catch (err) {
    if (err instanceof RangeError) {
      throw new TrialCannotRun(`matrix ${index + 1} of the set cannot be built: ${err.message}`);
    }
    throw err;
  }
}

function uploaded(
  item: ItemRow,
  index: number,
  files: Map<number, { fileName: string; content: string }>,
): ReferenceMatrix {
  const file = item.uploadId === null ? undefined : files.get(item.uploadId);
  if (!file) throw new TrialCannotRun(`matrix ${index + 1} of the set refers to a missing upload`);
  let parsed;
  try {
    parsed = parseMatrixMarket(file.content);
  } catch (err) {
    const reason = err instanceof Error ? err.message : String(err);
    throw new TrialCannotRun(`the uploaded file ${file.fileName} cannot be read: ${reason}`);
  }
  return matrixFromFile(file.fileName, parsed);
}

/**
 * Builds a matrix set's matrices in order: generated items from their recipe, uploads from the
 * stored Matrix Market text. An item that cannot be built makes the trial unable to run. Ids
 * are made unique (result rows are keyed by trial and matrix id): a repeated recipe is the same
 * matrix and runs once; two different uploads with the same file name get the item's position.
 */
export async function buildSetMatrices(db: Db, matrixSetId: number): Promise<ReferenceMatrix[]> {
  const items = await db
    .select()
    .from(matrixSetItems)
    .where(eq(matrixSetItems.matrixSetId, matrixSetId))
    .orderBy(asc(matrixSetItems.position), asc(matrixSetItems.id));
  const uploadIds = items.flatMap((i) => (i.kind === 'upload' && i.uploadId ? [i.uploadId] : []));
  const files = new Map<number, { fileName: string; content: string }>();
  if (uploadIds.length > 0) {
    const rows = await db
      .select({ id: uploads.id, fileName: uploads.fileName, content: uploads.content })
      .from(uploads)
      .where(inArray(uploads.id, uploadIds));
    for (const row of rows) files.set(row.id, row);
  }

  const matrices: ReferenceMatrix[] = [];
  const seen = new Set<string>();
  for (const [index, item] of items.entries()) {
    let matrix = item.kind === 'generated' ? generated(item, index) : uploaded(item, index, files);
    if (seen.has(matrix.id)) {
      if (item.kind === 'generated') continue;
      matrix = { ...matrix, id: `${matrix.id}-${index + 1}` };
    }
    seen.add(matrix.id);
    matrices.push(matrix);
  }
  return matrices;
}
