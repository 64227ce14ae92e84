import type { MatrixSetItemInput } from '@shared/api/matrix-sets.ts';
import { familyDefinitions, resolveMatrixSpec } from '@sandbox/matrices/generate.ts';
import type { FamilySlug } from '@sandbox/matrices/reference-matrix.ts';
import { AppError } from '@server/http/errors.ts';
import type { DbOrTx } from '@server/mail/outbox.repo.ts';
import { findTeamUploads } from '@server/uploads/uploads.repo.ts';
import type { NewMatrixSetItem } from './matrix-sets.repo.ts';

interface Problem {
  path: string;
  message: string;
}

/**
 * A generated item checked by the engine's own rules for its family (size, shape, parameters),
 * as it will be stored: with the defaults filled in, m only for rectangular families and the
 * seed only for seeded ones, so that the recipe means the same matrix on every run.
 */
function generatedItem(item: Extract<MatrixSetItemInput, { kind: 'generated' }>) {
  const { kind: _kind, ...spec } = item;
  const resolved = resolveMatrixSpec({ ...spec, family: spec.family as FamilySlug });
  const def = familyDefinitions[resolved.family];
  return {
    kind: 'generated' as const,
    family: resolved.family,
    n: resolved.n,
    m: def.rectangular ? resolved.m : null,
    seed: def.seeded ? resolved.seed : null,
    params: resolved.params,
    uploadId: null,
  };
}

/**
 * Checks every item of a set and answers the rows to store, or a 400 naming each bad item by
 * its index: generated recipes through the engine's validation, uploads by belonging to the
 * team.
 */
export async function checkMatrixSetItems(
  db: DbOrTx,
  teamId: number,
  items: MatrixSetItemInput[],
): Promise<NewMatrixSetItem[]> {
  const problems: Problem[] = [];
  const uploadIds = items.flatMap((i) => (i.kind === 'upload' ? [i.uploadId] : []));
  const found = new Set((await findTeamUploads(db, teamId, uploadIds)).map((u) => u.id));
  const rows = items.map((item, index): NewMatrixSetItem | null => {
    if (item.kind === 'upload') {
      if (found.has(item.uploadId)) return { kind: 'upload', uploadId: item.uploadId };
      problems.push({
        path: `items.${index}.uploadId`,
        message: 'no upload of this team has this id',
      });
      return null;
    }
    try {
      return generatedItem(item);
    } catch (err) {
      if (!(err instanceof RangeError)) throw err;
      problems.push({ path: `items.${index}`, message: err.message });
      return null;
    }
  });
  if (problems.length > 0) {
    throw new AppError('validation-failed', 'Some matrices of the set are not valid.', problems);
  }
  return rows.filter((r): r is NewMatrixSetItem => r !== null);
}
