import { generateMatrix } from '../matrices/generate.ts';
import type { ReferenceMatrix } from '../matrices/reference-matrix.ts';
import type { MatrixSet } from '../matrices/sets.ts';
import { parseMatrixMarket } from '../matrix-market/read.ts';
import { matrixFromFile } from './file-matrix.ts';

/**
 * Turns a matrix set's recipes into matrices. Files are read through `readFile` (the command
 * line reads the disk, the worker reads uploads from the database), so the engine needs no I/O.
 */
export function materializeSet(
  set: MatrixSet,
  readFile: (path: string) => string,
): ReferenceMatrix[] {
  return set.items.map((item) => {
    if (item.kind === 'generated') return generateMatrix(item.spec);
    const parsed = parseMatrixMarket(readFile(item.path));
    return matrixFromFile(item.path, parsed);
  });
}
