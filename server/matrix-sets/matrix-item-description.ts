import type { MatrixSetItem } from '@shared/api/matrix-sets.ts';
import { generateMatrix } from '@sandbox/matrices/generate.ts';
import type { FamilySlug } from '@sandbox/matrices/reference-matrix.ts';
import type { MatrixSetItemRow } from './matrix-sets.repo.ts';

/** Matrices up to this many entries are generated whole to read their symmetry. */
const wholeLimit = 128 * 128;
/** Larger ones are judged by an instance of this order from the same recipe. */
const probeOrder = 16;
const symmetryCache = new Map<string, string>();
const cacheLimit = 1000;

/**
 * Whether a generated square matrix is symmetric, read off the generated bits. A large one is
 * judged by a 16×16 instance of the same recipe: every family is symmetric by construction or
 * not at all, whatever the order. When that instance cannot be built (a parameter only valid at
 * the larger order) the answer is `unknown`. Rectangular matrices are `general`.
 */
function generatedSymmetry(row: MatrixSetItemRow, n: number, m: number): string {
  if (m !== n) return 'general';
  const spec = {
    family: row.family as FamilySlug,
    n: n * n <= wholeLimit ? n : probeOrder,
    ...(row.seed === null ? {} : { seed: row.seed }),
    ...(row.params === null ? {} : { params: row.params }),
  };
  const key = JSON.stringify(spec);
  let symmetry = symmetryCache.get(key);
  if (symmetry === undefined) {
    try {
      symmetry = generateMatrix(spec).properties.symmetric ? 'symmetric' : 'general';
    } catch (err) {
      if (!(err instanceof RangeError)) throw err;
      symmetry = 'unknown';
    }
    if (symmetryCache.size >= cacheLimit) symmetryCache.clear();
    symmetryCache.set(key, symmetry);
  }
  return symmetry;
}

function paramsText(params: Record<string, number> | null): string {
  const entries = Object.entries(params ?? {});
  return entries.length === 0 ? '' : ` (${entries.map(([k, v]) => `${k}=${v}`).join(', ')})`;
}

/** A stored item with its shape, entry count, symmetry and a one-line description. */
export function describeItem(row: MatrixSetItemRow): MatrixSetItem {
  const common = {
    position: row.position,
    kind: row.kind,
    family: row.family,
    n: row.n,
    m: row.m,
    seed: row.seed,
    params: row.params,
    uploadId: row.uploadId,
    fileName: row.fileName,
  };
  if (row.kind === 'upload') {
    const rows = row.fileRows ?? 0;
    const cols = row.fileCols ?? 0;
    const entries = row.fileEntries ?? 0;
    const symmetry = row.fileSymmetry ?? 'unknown';
    const description = `${row.fileName}, ${rows}×${cols}, ${entries} entries, ${symmetry}`;
    return { ...common, rows, cols, entries, symmetry, description };
  }
  const cols = row.n ?? 0;
  const rows = row.m ?? cols;
  const symmetry = generatedSymmetry(row, cols, rows);
  const seed = row.seed === null ? '' : `, seed ${row.seed}`;
  const entries = rows * cols;
  const description = `${row.family}${paramsText(row.params)}, ${rows}×${cols}${seed}, ${entries} entries, ${symmetry}`;
  return { ...common, rows, cols, entries, symmetry, description };
}
