import { readFileSync } from 'node:fs';
import path from 'node:path';
import { namedSet, parseMatrixSetJson, type MatrixSet } from '../matrices/sets.ts';
import type { ReferenceMatrix } from '../matrices/reference-matrix.ts';
import { materializeSet } from '../trial/materialize-set.ts';

/** Largest file the command line will read for a set or a matrix (bytes). */
const MAX_FILE_BYTES = 64 * 1024 * 1024;

function readText(file: string): string {
  const bytes = readFileSync(file);
  if (bytes.length > MAX_FILE_BYTES)
    throw new Error(`${file} is larger than ${MAX_FILE_BYTES} bytes`);
  return bytes.toString('utf8');
}

/** Resolves `quick`, `standard` or a JSON file into a set and its matrices; file paths are relative to the JSON file. */
export function loadSet(nameOrPath: string): {
  set: MatrixSet;
  matrices: ReferenceMatrix[];
  ms: number;
} {
  const started = performance.now();
  const loaded = loadSetUntimed(nameOrPath);
  return { ...loaded, ms: performance.now() - started };
}

function loadSetUntimed(nameOrPath: string): { set: MatrixSet; matrices: ReferenceMatrix[] } {
  if (nameOrPath === 'quick' || nameOrPath === 'standard') {
    const set = namedSet(nameOrPath);
    return { set, matrices: materializeSet(set, () => '') };
  }
  let value: unknown;
  try {
    value = JSON.parse(readText(nameOrPath));
  } catch (err) {
    throw new Error(`Cannot read the matrix set ${nameOrPath}: ${(err as Error).message}`, {
      cause: err,
    });
  }
  const set = parseMatrixSetJson(value, path.basename(nameOrPath));
  const dir = path.dirname(path.resolve(nameOrPath));
  return { set, matrices: materializeSet(set, (file) => readText(path.resolve(dir, file))) };
}
